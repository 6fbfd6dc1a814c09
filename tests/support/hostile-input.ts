import fc from "fast-check";
import { expect } from "vitest";

// Hostile values shared by the property tests that attack route handlers (JSON bodies) and
// server actions (form data), and the check that no answer shows the app's insides.

/** Keys that name the prototype's own members, as a prototype-pollution attempt sends them. */
export const pollutingKey = fc.constantFrom("__proto__", "constructor", "prototype", "toString", "hasOwnProperty");

/** 100 k to 2 M characters: the length of a huge text, for tests that build it only when sending. */
export const hugeLength = fc.integer({ min: 100_000, max: 2_000_000 });

/** 100 kB to 4 MB of a two-byte character. */
export const hugeString = hugeLength.map((length) => "Ω".repeat(length));

/** Short text that is not what any field expects: random, binary, path tricks, injections, odd whitespace. */
export const hostileText = fc.oneof(
  fc.string({ maxLength: 80 }),
  fc.string({ unit: "binary", maxLength: 80 }),
  fc.uuid(),
  fc.constantFrom("../../etc/passwd", "..%2F..%2F", "%00", "' or '1'='1", "<script>x</script>", "x".repeat(10_000), "NaN", "-1", " ", "\n"),
);

/** A stack frame, an error class name with a path, or a source path: nothing a visitor should read. */
export function expectNoInternals(text: string, context?: string): void {
  expect(text, context).not.toMatch(/\n\s+at\s|\bat\s+\S+\s+\(|node_modules|\/work\/|\.tsx?:\d+|TypeError|RangeError|SyntaxError/);
}

/** A request body of one malformed kind, with the content type it is sent under (none when undefined). */
export type HostileBody = { kind: string; contentType: string | undefined; body: Uint8Array<ArrayBuffer> };

const text = (value: string) => new TextEncoder().encode(value);
/** Bytes that are no text in any encoding: every value, in an order that repeats only after 256. */
const garbage = Uint8Array.from({ length: 4096 }, (_, i) => (i * 167 + 13) % 256);
const multipartBody = text('--edge\r\nContent-Disposition: form-data; name="0"\r\n\r\n["x"]\r\n--edge--\r\n');

/**
 * Malformed bodies of every kind a reporter tried against the server actions and routes, to be
 * sent chunked and with a length: not JSON, JSON cut short or of the wrong shape, multipart without
 * or with the wrong boundary or cut short, URL-encoded junk, bytes that are no text, nothing at all,
 * a wrong or missing content type, nesting deeper than any parser's stack, references to parts that
 * were never sent (the server-action reply format), and a body over `tooLargeBytes`.
 */
export function hostileBodies(tooLargeBytes: number): HostileBody[] {
  const kinds: [string, string | undefined, Uint8Array<ArrayBuffer> | string][] = [
    ["empty body", "text/plain;charset=UTF-8", ""],
    ["plain text", "text/plain;charset=UTF-8", "This is a note, not a form or JSON."],
    ["truncated JSON", "text/plain;charset=UTF-8", '[{"status":"idle"},{"choices":{"main":'],
    ["truncated JSON as JSON", "application/json", '{"choices":{"main":{"seriesResistance":'],
    ["JSON number", "text/plain;charset=UTF-8", "42"],
    ["JSON null", "application/json", "null"],
    ["JSON string", "text/plain;charset=UTF-8", '"a string"'],
    ["JSON array of numbers", "application/json", "[1,2,3]"],
    ["JSON object with polluting keys", "application/json", '{"__proto__":{"polluted":true},"constructor":{"prototype":{"polluted":true}}}'],
    ["multipart without a boundary", "multipart/form-data", multipartBody],
    ["multipart with another boundary", "multipart/form-data; boundary=elsewhere", multipartBody],
    ["multipart cut short", "multipart/form-data; boundary=edge", multipartBody.subarray(0, 40)],
    ["multipart with a base64 file", "multipart/form-data; boundary=edge", '--edge\r\nContent-Disposition: form-data; name="0"\r\n\r\n["$K1"]\r\n--edge\r\nContent-Disposition: form-data; name="_1_file"; filename="a.csv"\r\nContent-Transfer-Encoding: base64\r\n\r\nbmFtZQ==\r\n--edge--\r\n'],
    ["URL-encoded junk", "application/x-www-form-urlencoded", "a=%zz&&=&%E0%A4%A=b&&"],
    ["binary garbage", "application/octet-stream", garbage],
    ["binary garbage as text", "text/plain;charset=UTF-8", garbage],
    ["binary garbage as JSON", "application/json", garbage],
    ["wrong content type", "application/xml", "<submission><choices/></submission>"],
    ["no content type", undefined, '{"choices":{}}'],
    ["nesting 100,000 deep", "text/plain;charset=UTF-8", "[".repeat(100_000) + "]".repeat(100_000)],
    ["reference to a missing part", "text/plain;charset=UTF-8", '["$1","$@5"]'],
    ["reference to a map of a missing part", "text/plain;charset=UTF-8", '[{"status":"idle"},"$Q1"]'],
    ["reference to an action as an argument", "text/plain;charset=UTF-8", '["$h1"]'],
    ["reference to a value that is not there", "text/plain;charset=UTF-8", '[{"a":1},"$0:0:b"]'],
    ["over-long BigInt", "text/plain;charset=UTF-8", `["$n${"9".repeat(400)}"]`],
    ["huge body", "text/plain;charset=UTF-8", `["${"x".repeat(tooLargeBytes)}"]`],
  ];
  return kinds.map(([kind, contentType, body]) => ({ kind, contentType, body: typeof body === "string" ? text(body) : new Uint8Array(body) }));
}
