// Files built to pass as an image while carrying something else: a second file appended after the
// picture's end marker, or a script or markup that begins with an image's signature.
import { crc32 } from "node:zlib";

const text = (value: string) => new TextEncoder().encode(value);

export const concatBytes = (...parts: Uint8Array[]): Uint8Array => {
  const out = new Uint8Array(parts.reduce((total, part) => total + part.length, 0));
  parts.reduce((at, part) => (out.set(part, at), at + part.length), 0);
  return out;
};

export const htmlPayload = text("<!doctype html><html><body><script>fetch('/api/me').then(r=>r.text()).then(alert)</script></body></html>\n");

/** A ZIP archive holding one stored (uncompressed) file (APPNOTE.TXT 6.3.10 §4.3.7, §4.3.12, §4.3.16). */
export function zipArchive(fileName: string, content: Uint8Array): Uint8Array {
  const name = text(fileName);
  const le = (value: number, bytes: number) => Array.from({ length: bytes }, (_, i) => (value >>> (8 * i)) & 0xff);
  const entry = [...le(20, 2), 0, 0, 0, 0, 0, 0, 0, 0, ...le(crc32(content), 4), ...le(content.length, 4), ...le(content.length, 4), ...le(name.length, 2), 0, 0];
  const local = concatBytes(new Uint8Array([...le(0x04034b50, 4), ...entry]), name, content);
  const central = concatBytes(new Uint8Array([...le(0x02014b50, 4), ...le(20, 2), ...entry, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0]), name);
  const end = new Uint8Array([...le(0x06054b50, 4), 0, 0, 0, 0, 1, 0, 1, 0, ...le(central.length, 4), ...le(local.length, 4), 0, 0]);
  return concatBytes(local, central, end);
}

/** Opens with GIF89a and a logical screen, and parses as JavaScript: the header becomes a comment. */
export const gifScript = text("GIF89a/*\u0001\u0000\u0001\u0000\u0000\u0000\u0000*/=0;alert(document.cookie);//;");

export const svgWithScript = text(`<svg xmlns="http://www.w3.org/2000/svg" width="320" height="240" onload="alert(document.cookie)"><rect width="320" height="240"/></svg>`);
