import { openCertificatePdf } from "@/lib/certificates/download";
import { findViewerOfRequest } from "@/lib/uploads/request-viewer";

export async function GET(request: Request, { params }: { params: Promise<{ certificateId: string }> }) {
  const { certificateId } = await params;
  return openCertificatePdf({ certificateId, viewer: await findViewerOfRequest(request) });
}
