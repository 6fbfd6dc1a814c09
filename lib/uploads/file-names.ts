import type { ImageContentType } from "./image-content";

// An uploaded file's name is whatever the learner's device called it: free text to show, never a
// path. Files are stored under the upload service's generated keys; these names are only shown on
// pages and offered when a photo is saved.

const maxDisplayNameLength = 120;
const fallbackName = "photo";
const extensionOf: Record<ImageContentType, string> = { "image/png": ".png", "image/jpeg": ".jpg", "image/webp": ".webp" };

// Control, format (bidirectional overrides, zero-width) and line/paragraph separator characters:
// they can hide or reorder what the name appears to say.
const invisibleCharacters = /[\p{Cc}\p{Cf}\p{Zl}\p{Zp}]/gu;

function truncateKeepingExtension(name: string): string {
  const characters = [...name];
  if (characters.length <= maxDisplayNameLength) return name;
  const extension = /\.[\p{L}\p{N}]{1,8}$/u.exec(name)?.[0] ?? "";
  return characters.slice(0, maxDisplayNameLength - extension.length).join("").trimEnd() + extension;
}

/**
 * The name to show for an uploaded file: the last segment of any path it carries, without
 * invisible characters, runs of spaces collapsed, at most 120 characters with the extension kept.
 */
export function displayNameOf(uploadedName: string): string {
  const lastSegment = uploadedName.split(/[/\\]/).pop() ?? "";
  const visible = lastSegment.replace(invisibleCharacters, "").replace(/\s+/g, " ").trim();
  return /[\p{L}\p{N}]/u.test(visible) ? truncateKeepingExtension(visible) : fallbackName;
}

/** The name a saved copy gets: the display name with the extension of what the bytes really are. */
export function downloadNameOf(displayName: string, contentType: ImageContentType): string {
  return displayName.replace(/\.[^.\s]{1,8}$/, "") + extensionOf[contentType];
}

// RFC 8187 §3.2.1: outside attr-char everything is percent-encoded, and encodeURIComponent leaves
// ' ( ) * as they are.
const encodeAttrValue = (value: string) => encodeURIComponent(value).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

/**
 * A Content-Disposition that shows the file in place and names its saved copy (RFC 6266 §4.3): a
 * plain ASCII `filename` for old clients and the exact name in `filename*`.
 */
export function inlineContentDisposition(fileName: string): string {
  const asciiFallback = fileName.replace(/[^\x20-\x7e]|["\\%]/g, "_");
  return `inline; filename="${asciiFallback}"; filename*=UTF-8''${encodeAttrValue(fileName)}`;
}
