import { bodyTooLarge, type BodyLimit } from "./body-limits";

/**
 * The request's body, read only up to its limit: a declared Content-Length above it is refused
 * before a byte is read, and a body without one (chunked) is counted as it arrives and dropped
 * the moment it passes the limit. Throws a 413 AppError; nothing past the limit is kept.
 */
export async function readBodyWithin(request: Request, limit: BodyLimit): Promise<Uint8Array<ArrayBuffer>> {
  const declared = Number(request.headers.get("content-length") ?? Number.NaN);
  if (declared > limit.bytes) throw bodyTooLarge(limit);
  if (!request.body) return new Uint8Array();

  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > limit.bytes) {
      await reader.cancel().catch(() => undefined);
      throw bodyTooLarge(limit);
    }
    chunks.push(value);
  }
  const body = new Uint8Array(received);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}
