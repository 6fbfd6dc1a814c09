import { createUploadRouteHandler } from "@/lib/uploads/route-handler";

export const { GET, POST } = createUploadRouteHandler();
