import { describe, expect, it } from "vitest";
import { tokenSchema } from "@/lib/auth/fields";
import { generateToken, hashToken } from "@/lib/auth/tokens";

describe("tokens", () => {
  it("hashes with SHA-256 (FIPS 180-2 test vector for \"abc\")", () => {
    expect(hashToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("generates 256-bit URL-safe tokens that the link schema accepts", () => {
    const tokens = Array.from({ length: 200 }, generateToken);
    for (const token of tokens) {
      expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(tokenSchema.safeParse(token).success).toBe(true);
    }
    expect(new Set(tokens).size).toBe(tokens.length);
  });

  it("rejects link tokens of the wrong shape before any lookup", () => {
    for (const token of ["abc", `${generateToken()}x`, `${generateToken().slice(0, 42)}!`, "../../etc/passwd"]) {
      expect(tokenSchema.safeParse(token).success).toBe(false);
    }
  });
});
