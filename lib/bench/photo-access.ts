import "server-only";
import { z } from "zod";
import { findBenchPhotoForViewer } from "@/db/queries/bench";
import type { SessionUser } from "@/lib/auth/session-store";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { downloadNameOf, inlineContentDisposition } from "@/lib/uploads/file-names";
import { isImageContentType } from "@/lib/uploads/image-content";
import { fetchStoredFile } from "@/lib/uploads/stored-files";

/**
 * A bench photo for one viewer: streamed from the upload service when they may see it; otherwise
 * 404, the same answer as for an id that does not exist, so ids are never confirmed.
 */
export async function openBenchPhoto(params: { photoId: string; viewer: SessionUser | null }): Promise<Response> {
  try {
    return await streamVisiblePhoto(params);
  } catch (error) {
    return errorResponse(error);
  }
}

async function streamVisiblePhoto(params: { photoId: string; viewer: SessionUser | null }): Promise<Response> {
  if (!params.viewer) return errorResponse(new AppError("unauthenticated"));
  if (!z.uuid().safeParse(params.photoId).success) return errorResponse(new AppError("not-found"));
  const photo = await findBenchPhotoForViewer({ photoId: params.photoId, viewer: params.viewer });
  if (!photo) return errorResponse(new AppError("not-found"));

  // Only a row the content check wrote is served, and always as the image type it found.
  if (!isImageContentType(photo.contentType)) return errorResponse(new AppError("not-found"));

  const stored = await fetchStoredFile(photo.fileKey);
  if (!stored.ok || !stored.body) {
    console.error(`The upload service answered ${stored.status} for bench photo ${photo.id}`);
    return errorResponse(new AppError("unavailable"));
  }
  return new Response(stored.body, {
    headers: {
      "content-type": photo.contentType,
      "content-length": String(photo.size),
      "content-disposition": inlineContentDisposition(downloadNameOf(photo.name, photo.contentType)),
      // Only this viewer's browser may keep it; a shared cache must not.
      "cache-control": "private, max-age=3600",
      "x-content-type-options": "nosniff",
    },
  });
}
