import { displayNameOf } from "@/lib/uploads/file-names";
import { imageContentTypes, isImageContentType } from "@/lib/uploads/image-content";

// One set of limits for the page (instant messages before anything is sent), the upload route
// (the rule) and the upload service's own file route configuration.

export const benchPhotoLimits = {
  maxBytes: 8 * 1024 * 1024,
  /** The same limit in the upload SDK's notation (it counts 1 MB as 1024² bytes). */
  maxFileSize: "8MB",
  minPhotos: 1,
  maxPhotos: 4,
  contentTypes: imageContentTypes,
} as const;

export type DeclaredFile = { name: string; size: number; type: string };

export function formatFileSize(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024))} KB`;
  return `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;
}

/** Why these files cannot join a submission that already holds `stored` photos, or null when they can. */
export function refuseDeclaredPhotos(files: readonly DeclaredFile[], stored: number): string | null {
  if (files.length === 0) return "Choose at least one photo.";
  const room = benchPhotoLimits.maxPhotos - stored;
  if (files.length > room) {
    return room <= 0
      ? `This submission already holds ${benchPhotoLimits.maxPhotos} photos, the most it can. Remove one to add another.`
      : `A submission holds at most ${benchPhotoLimits.maxPhotos} photos: you can add ${room} more.`;
  }
  for (const file of files) {
    const name = displayNameOf(file.name);
    if (!isImageContentType(file.type)) {
      return `“${name}” is not a PNG, JPEG or WebP image. Photograph the scope screen and upload the photo itself.`;
    }
    if (file.size > benchPhotoLimits.maxBytes) {
      return `“${name}” is larger than ${formatFileSize(benchPhotoLimits.maxBytes)}, the most a photo may be. Save it smaller and try again.`;
    }
    if (file.size === 0) return `“${name}” is empty (0 bytes). Choose the photo file itself and try again.`;
  }
  return null;
}
