import { randomBytes } from "node:crypto";

// Verification codes: 10 random bytes (80 bits) written as 16 characters of Crockford's base32,
// which leaves out I, L, O and U so a code read aloud or typed from paper is hard to get wrong.
// Shown in four groups of four.

const alphabet = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";
export const codeLength = 16;
const codeBytes = 10;

/** Typed look-alikes read as the digit they resemble, as Crockford's scheme allows. */
const lookAlikes: Record<string, string> = { O: "0", I: "1", L: "1" };

export function encodeCertificateCode(bytes: Uint8Array): string {
  if (bytes.length !== codeBytes) throw new RangeError(`A certificate code takes exactly ${codeBytes} bytes.`);
  let out = "";
  let buffer = 0;
  let bits = 0;
  for (const byte of bytes) {
    buffer = (buffer << 8) | byte;
    bits += 8;
    while (bits >= 5) {
      bits -= 5;
      out += alphabet[(buffer >> bits) & 31];
    }
    buffer &= (1 << bits) - 1;
  }
  return out;
}

export function generateCertificateCode(): string {
  return encodeCertificateCode(randomBytes(codeBytes));
}

/** "ABCDEFGHJKMNPQRS" → "ABCD-EFGH-JKMN-PQRS". */
export function formatCertificateCode(code: string): string {
  return code.match(/.{1,4}/g)!.join("-");
}

/**
 * The stored form of a code someone typed or followed a link with, or null when it cannot be one:
 * case, spaces and dashes do not matter; anything else outside the alphabet makes it malformed.
 */
export function parseCertificateCode(input: string): string | null {
  if (input.length > 64) return null;
  const compact = input.toUpperCase().replace(/[\s-]/g, "");
  const mapped = [...compact].map((char) => lookAlikes[char] ?? char).join("");
  if (mapped.length !== codeLength) return null;
  return [...mapped].every((char) => alphabet.includes(char)) ? mapped : null;
}
