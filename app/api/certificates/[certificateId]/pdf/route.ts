import { openCertificatePdf } from "@/lib/certificates/download";
import { respondSafely } from "@/lib/http/respond";
import { findViewerOfRequest } from "@/lib/uploads/request-viewer";

export async function GET(request: Request, { params }: { params: Promise<{ certificateId: string }> }) {
  const { certificateId } = await params;
  return respondSafely(async () => openCertificatePdf({ certificateId, viewer: await findViewerOfRequest(request) }));
}
