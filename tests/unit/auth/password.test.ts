import { describe, expect, it } from "vitest";
import { hashPassword, verifyAgainstDummy, verifyPassword } from "@/lib/auth/password";

describe("password hashing", () => {
  it("stores argon2id with 19 MiB, 2 passes, 1 lane and a random salt", async () => {
    const first = await hashPassword("a sentence about pixels");
    const second = await hashPassword("a sentence about pixels");
    expect(first).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(first).not.toBe(second);
  });

  it("verifies the right password and refuses a wrong one", async () => {
    const stored = await hashPassword("a sentence about pixels");
    expect(await verifyPassword(stored, "a sentence about pixels")).toBe(true);
    expect(await verifyPassword(stored, "a sentence about pixel")).toBe(false);
  });

  it("treats a damaged stored hash as a mismatch rather than an error", async () => {
    expect(await verifyPassword("not-a-hash", "anything")).toBe(false);
  });

  it("never accepts a password through the dummy check", async () => {
    expect(await verifyAgainstDummy("edgewise-timing-equaliser")).toBe(false);
  });
});
