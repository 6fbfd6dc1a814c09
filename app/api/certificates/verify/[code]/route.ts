import { answerVerificationRequest } from "@/lib/certificates/verification-response";
import { respondSafely } from "@/lib/http/respond";

export async function GET(request: Request, { params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  return respondSafely(() => answerVerificationRequest({ request, code }));
}
