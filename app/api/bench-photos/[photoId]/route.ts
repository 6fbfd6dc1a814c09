import { openBenchPhoto } from "@/lib/bench/photo-access";
import { respondSafely } from "@/lib/http/respond";
import { findViewerOfRequest } from "@/lib/uploads/request-viewer";

export async function GET(request: Request, { params }: { params: Promise<{ photoId: string }> }) {
  const { photoId } = await params;
  return respondSafely(async () => openBenchPhoto({ photoId, viewer: await findViewerOfRequest(request) }));
}
