// Decides what an uploaded file is from its bytes, never from its name or declared type: the
// format's signature and the header that carries its pixel size. A file whose header cannot be
// read to a size is not treated as an image.

export const imageContentTypes = ["image/png", "image/jpeg", "image/webp"] as const;
export type ImageContentType = (typeof imageContentTypes)[number];

export type ImageContent = { contentType: ImageContentType; width: number; height: number };

const ascii = (bytes: Uint8Array, at: number, length: number) => String.fromCharCode(...bytes.subarray(at, at + length));
const u16be = (b: Uint8Array, at: number) => (b[at]! << 8) | b[at + 1]!;
const u16le = (b: Uint8Array, at: number) => b[at]! | (b[at + 1]! << 8);
const u24le = (b: Uint8Array, at: number) => b[at]! | (b[at + 1]! << 8) | (b[at + 2]! << 16);
const u32be = (b: Uint8Array, at: number) => ((b[at]! << 24) | (b[at + 1]! << 16) | (b[at + 2]! << 8) | b[at + 3]!) >>> 0;
const u32le = (b: Uint8Array, at: number) => (b[at]! | (b[at + 1]! << 8) | (b[at + 2]! << 16) | (b[at + 3]! << 24)) >>> 0;

const pngSignature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/** PNG (ISO/IEC 15948, W3C PNG 3rd ed. §5.2, §11.2.1): the signature, then IHDR first with width and height. */
function readPng(b: Uint8Array): ImageContent | null {
  if (b.length < 24 || pngSignature.some((value, i) => b[i] !== value) || ascii(b, 12, 4) !== "IHDR") return null;
  return { contentType: "image/png", width: u32be(b, 16), height: u32be(b, 20) };
}

// Start-of-frame markers carry the frame size; C4 (DHT), C8 (JPG) and CC (DAC) share the range but do not.
const startOfFrame = new Set([0xc0, 0xc1, 0xc2, 0xc3, 0xc5, 0xc6, 0xc7, 0xc9, 0xca, 0xcb, 0xcd, 0xce, 0xcf]);

/** JPEG (ITU-T T.81 Annex B): SOI, then marker segments up to the first SOFn, whose header holds Y and X. */
function readJpeg(b: Uint8Array): ImageContent | null {
  if (b.length < 4 || b[0] !== 0xff || b[1] !== 0xd8 || b[2] !== 0xff) return null;
  let at = 2;
  while (at + 3 < b.length) {
    if (b[at] !== 0xff) return null;
    const marker = b[at + 1]!;
    if (marker === 0xff) {
      at += 1; // fill byte (B.1.1.2)
      continue;
    }
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      at += 2; // markers without a length (TEM, RSTn)
      continue;
    }
    if (marker === 0xd9 || marker === 0xda) return null; // end of image or start of scan before any frame
    const length = u16be(b, at + 2);
    if (length < 2) return null;
    if (startOfFrame.has(marker)) {
      if (at + 9 > b.length) return null;
      return { contentType: "image/jpeg", height: u16be(b, at + 5), width: u16be(b, at + 7) };
    }
    at += 2 + length;
  }
  return null;
}

/** WebP (RFC 9649): a RIFF "WEBP" file whose first chunk is VP8 (lossy), VP8L (lossless) or VP8X (extended). */
function readWebp(b: Uint8Array): ImageContent | null {
  if (b.length < 30 || ascii(b, 0, 4) !== "RIFF" || ascii(b, 8, 4) !== "WEBP") return null;
  const chunk = ascii(b, 12, 4);
  if (chunk === "VP8 ") {
    // RFC 6386 §9.1: a 3-byte frame tag, the start code 9d 01 2a, then 14-bit width and height.
    if (b[23] !== 0x9d || b[24] !== 0x01 || b[25] !== 0x2a) return null;
    return { contentType: "image/webp", width: u16le(b, 26) & 0x3fff, height: u16le(b, 28) & 0x3fff };
  }
  if (chunk === "VP8L") {
    if (b[20] !== 0x2f) return null;
    const bits = u32le(b, 21);
    return { contentType: "image/webp", width: (bits & 0x3fff) + 1, height: ((bits >>> 14) & 0x3fff) + 1 };
  }
  if (chunk === "VP8X") return { contentType: "image/webp", width: u24le(b, 24) + 1, height: u24le(b, 27) + 1 };
  return null;
}

/** The image the bytes hold, or null when they are not a PNG, JPEG or WebP with a readable size. */
export function readImageContent(bytes: Uint8Array): ImageContent | null {
  const image = readPng(bytes) ?? readJpeg(bytes) ?? readWebp(bytes);
  return image && image.width > 0 && image.height > 0 ? image : null;
}
