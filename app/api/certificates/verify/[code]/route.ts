import { answerVerificationRequest } from "@/lib/certificates/verification-response";

export async function GET(request: Request, { params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  return answerVerificationRequest({ request, code });
}
