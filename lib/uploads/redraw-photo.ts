// Runs in the browser, before a photo is sent.

const jpegQuality = 0.92;

/**
 * The photo redrawn from its pixels, in its own format. What a camera stores beside the picture —
 * where it was taken, when, with which device — is not carried over, and the rotation the camera
 * asked for is applied to the pixels, so the photo still shows upright. A file the browser cannot
 * decode or re-encode is returned as chosen: the server judges it by its content either way.
 */
export async function redrawnPhoto(file: File): Promise<File> {
  if (typeof createImageBitmap !== "function" || typeof OffscreenCanvas === "undefined") return file;
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: "from-image" });
  } catch {
    return file;
  }
  try {
    const canvas = new OffscreenCanvas(bitmap.width, bitmap.height);
    canvas.getContext("2d")!.drawImage(bitmap, 0, 0);
    const blob = await canvas.convertToBlob({ type: file.type, quality: jpegQuality });
    // A browser that cannot write this format hands back a PNG instead: keep the original then.
    if (blob.type !== file.type) return file;
    return new File([blob], file.name, { type: file.type, lastModified: file.lastModified });
  } catch {
    return file;
  } finally {
    bitmap.close();
  }
}
