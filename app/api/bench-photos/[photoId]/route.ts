import { openBenchPhoto } from "@/lib/bench/photo-access";
import { findViewerOfRequest } from "@/lib/uploads/request-viewer";

export async function GET(request: Request, { params }: { params: Promise<{ photoId: string }> }) {
  const { photoId } = await params;
  return openBenchPhoto({ photoId, viewer: await findViewerOfRequest(request) });
}
