import "server-only";
import { UTApi } from "uploadthing/server";
import { readUploadSettings } from "./settings";

// Stored files are never linked to browsers: the app fetches them with its own credentials and
// passes them on after its access check.

function fileApi(): UTApi {
  return new UTApi({ logLevel: "Warning" });
}

/**
 * The stored file's bytes as the service answers them. The local service hands files to holders
 * of the API key; the hosted one serves a private file through a short-lived signed URL.
 */
export async function fetchStoredFile(fileKey: string): Promise<Response> {
  const { apiKey, localServiceUrl } = readUploadSettings();
  if (localServiceUrl) {
    return fetch(`${localServiceUrl}/f/${encodeURIComponent(fileKey)}`, {
      headers: { "x-uploadthing-api-key": apiKey },
      cache: "no-store",
    });
  }
  const { ufsUrl } = await fileApi().generateSignedURL(fileKey, { expiresIn: 60 });
  return fetch(ufsUrl, { cache: "no-store" });
}

export async function deleteStoredFiles(fileKeys: string[]): Promise<void> {
  if (fileKeys.length === 0) return;
  await fileApi().deleteFiles(fileKeys);
}
