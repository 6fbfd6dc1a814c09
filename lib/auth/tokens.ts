import { createHash, randomBytes } from "node:crypto";

/** A URL-safe secret for e-mailed links: 32 random bytes, 256 bits. */
export function generateToken(): string {
  return randomBytes(32).toString("base64url");
}

/** Links carry the token; the database keeps only this digest. */
export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}
