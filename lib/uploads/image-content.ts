// Decides what an uploaded file is from its bytes, never from its name or declared type: the
// format's signature, the header that carries its pixel size, and the structure up to the format's
// own end marker. A file whose structure cannot be followed to that end is not treated as an
// image, and the reading says where the image ends so that anything appended after it (another
// file hidden behind the picture) can be refused.

export const imageContentTypes = ["image/png", "image/jpeg", "image/webp"] as const;
export type ImageContentType = (typeof imageContentTypes)[number];

export const isImageContentType = (type: string): type is ImageContentType => (imageContentTypes as readonly string[]).includes(type);

export type ImageContent = { contentType: ImageContentType; width: number; height: number };

/** An image and the offset just past its last byte; bytes from `end` on are not part of it. */
export type ImageReading = ImageContent & { end: number };

const ascii = (bytes: Uint8Array, at: number, length: number) => String.fromCharCode(...bytes.subarray(at, at + length));
const u16be = (b: Uint8Array, at: number) => (b[at]! << 8) | b[at + 1]!;
const u16le = (b: Uint8Array, at: number) => b[at]! | (b[at + 1]! << 8);
const u24le = (b: Uint8Array, at: number) => b[at]! | (b[at + 1]! << 8) | (b[at + 2]! << 16);
const u32be = (b: Uint8Array, at: number) => ((b[at]! << 24) | (b[at + 1]! << 16) | (b[at + 2]! << 8) | b[at + 3]!) >>> 0;
const u32le = (b: Uint8Array, at: number) => (b[at]! | (b[at + 1]! << 8) | (b[at + 2]! << 16) | (b[at + 3]! << 24)) >>> 0;

const pngSignature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const pngChunkType = /^[A-Za-z]{4}$/;

/**
 * PNG (ISO/IEC 15948, W3C PNG 3rd ed.): the signature, then chunks of length, type, data and CRC
 * (§5.3), IHDR first with width and height (§11.2.1), at least one IDAT, and IEND last (§5.6).
 */
function readPng(b: Uint8Array): ImageReading | null {
  if (b.length < 24 || pngSignature.some((value, i) => b[i] !== value) || ascii(b, 12, 4) !== "IHDR") return null;
  let at = 8;
  let sawImageData = false;
  while (at + 12 <= b.length) {
    const type = ascii(b, at + 4, 4);
    if (!pngChunkType.test(type)) return null;
    const next = at + 12 + u32be(b, at);
    if (next > b.length) return null;
    if (type === "IDAT") sawImageData = true;
    if (type === "IEND") return sawImageData ? { contentType: "image/png", width: u32be(b, 16), height: u32be(b, 20), end: next } : null;
    at = next;
  }
  return null;
}

// Start-of-frame markers carry the frame size; C4 (DHT), C8 (JPG) and CC (DAC) share the range but do not.
const startOfFrame = new Set([0xc0, 0xc1, 0xc2, 0xc3, 0xc5, 0xc6, 0xc7, 0xc9, 0xca, 0xcb, 0xcd, 0xce, 0xcf]);
const isRestartMarker = (marker: number) => marker >= 0xd0 && marker <= 0xd7;

/**
 * The offset of the marker that ends a scan's entropy-coded data (T.81 B.1.1.5): the first 0xFF
 * that is neither a stuffed 0xFF00 nor a restart marker RSTn, which belong to the data.
 */
function endOfScan(b: Uint8Array, from: number): number {
  let at = b.indexOf(0xff, from);
  while (at >= 0 && at + 1 < b.length) {
    const next = b[at + 1]!;
    if (next !== 0x00 && next !== 0xff && !isRestartMarker(next)) return at;
    at = b.indexOf(0xff, next === 0xff ? at + 1 : at + 2);
  }
  return -1;
}

/**
 * JPEG (ITU-T T.81 Annex B): SOI, marker segments, a frame (SOFn, whose header holds Y and X) with
 * one or more scans (SOS and its entropy-coded data), then EOI.
 */
function readJpeg(b: Uint8Array): ImageReading | null {
  if (b.length < 4 || b[0] !== 0xff || b[1] !== 0xd8 || b[2] !== 0xff) return null;
  let frame: { width: number; height: number } | null = null;
  let sawScan = false;
  let at = 2;
  while (at + 1 < b.length) {
    if (b[at] !== 0xff) return null;
    const marker = b[at + 1]!;
    if (marker === 0xff) {
      at += 1; // fill byte (B.1.1.2)
      continue;
    }
    if (marker === 0x01 || isRestartMarker(marker)) {
      at += 2; // markers without a length (TEM, RSTn)
      continue;
    }
    if (marker === 0xd9) return frame && sawScan ? { contentType: "image/jpeg", ...frame, end: at + 2 } : null;
    if (at + 3 >= b.length) return null;
    const length = u16be(b, at + 2);
    if (length < 2 || at + 2 + length > b.length) return null;
    if (startOfFrame.has(marker) && !frame) {
      if (length < 7) return null;
      frame = { height: u16be(b, at + 5), width: u16be(b, at + 7) };
    }
    if (marker === 0xda) {
      if (!frame) return null; // a scan before any frame
      sawScan = true;
      at = endOfScan(b, at + 2 + length);
      if (at < 0) return null;
      continue;
    }
    at += 2 + length;
  }
  return null;
}

/**
 * WebP (RFC 9649 §2.5–2.7): a RIFF "WEBP" container whose size field covers the rest of the file,
 * whose first chunk is VP8 (lossy), VP8L (lossless) or VP8X (extended), and whose chunks, each
 * padded to an even length, fill the container exactly.
 */
function readWebp(b: Uint8Array): ImageReading | null {
  if (b.length < 30 || ascii(b, 0, 4) !== "RIFF" || ascii(b, 8, 4) !== "WEBP") return null;
  const end = 8 + u32le(b, 4);
  if (end > b.length || !chunksFill(b, 12, end)) return null;
  const size = readWebpSize(b);
  return size && { contentType: "image/webp", ...size, end };
}

function chunksFill(b: Uint8Array, from: number, end: number): boolean {
  let at = from;
  while (at + 8 <= end) {
    const size = u32le(b, at + 4);
    at += 8 + size + (size & 1);
  }
  return at === end;
}

function readWebpSize(b: Uint8Array): { width: number; height: number } | null {
  const chunk = ascii(b, 12, 4);
  if (chunk === "VP8 ") {
    // RFC 6386 §9.1: a 3-byte frame tag, the start code 9d 01 2a, then 14-bit width and height.
    if (b[23] !== 0x9d || b[24] !== 0x01 || b[25] !== 0x2a) return null;
    return { width: u16le(b, 26) & 0x3fff, height: u16le(b, 28) & 0x3fff };
  }
  if (chunk === "VP8L") {
    if (b[20] !== 0x2f) return null;
    const bits = u32le(b, 21);
    return { width: (bits & 0x3fff) + 1, height: ((bits >>> 14) & 0x3fff) + 1 };
  }
  if (chunk === "VP8X") return { width: u24le(b, 24) + 1, height: u24le(b, 27) + 1 };
  return null;
}

/**
 * The image the bytes hold and where it ends, or null when they are not a whole PNG, JPEG or WebP
 * with a readable size. Bytes after `end` are left for the caller to judge.
 */
export function readImageContent(bytes: Uint8Array): ImageReading | null {
  const image = readPng(bytes) ?? readJpeg(bytes) ?? readWebp(bytes);
  return image && image.width > 0 && image.height > 0 ? image : null;
}
