import { describe, expect, it } from "vitest";
import { z } from "zod";
import { emailSchema, newPasswordSchema, personNameSchema, withMatchingPasswords } from "@/lib/auth/fields";

describe("emailSchema", () => {
  it("trims and lower-cases so one address always maps to one account", () => {
    expect(emailSchema.parse("  Priya.Castellanos@Fernhallow.EXAMPLE ")).toBe("priya.castellanos@fernhallow.example");
  });

  it.each(["", "   ", "no-at-sign", "two@@example.test", `${"a".repeat(250)}@x.test`])("refuses %j with a message", (value) => {
    const result = emailSchema.safeParse(value);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toMatch(/e-mail/i);
  });
});

describe("newPasswordSchema", () => {
  it("accepts 10 to 200 characters", () => {
    expect(newPasswordSchema.safeParse("a".repeat(10)).success).toBe(true);
    expect(newPasswordSchema.safeParse("a".repeat(200)).success).toBe(true);
  });

  it("refuses short, overlong and blank passwords", () => {
    expect(newPasswordSchema.safeParse("a".repeat(9)).error?.issues[0]?.message).toBe("Use at least 10 characters.");
    expect(newPasswordSchema.safeParse("a".repeat(201)).success).toBe(false);
    expect(newPasswordSchema.safeParse(" ".repeat(12)).error?.issues[0]?.message).toMatch(/only spaces/);
  });
});

describe("personNameSchema", () => {
  it("trims and requires a name", () => {
    expect(personNameSchema.parse("  Ines Varga-Holm ")).toBe("Ines Varga-Holm");
    expect(personNameSchema.safeParse("   ").success).toBe(false);
  });
});

describe("withMatchingPasswords", () => {
  const schema = withMatchingPasswords(z.object({ password: z.string(), confirmPassword: z.string() }));

  it("reports a mismatch on the confirmation field", () => {
    const result = schema.safeParse({ password: "one long password", confirmPassword: "another one" });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(["confirmPassword"]);
  });

  it("passes matching passwords", () => {
    expect(schema.safeParse({ password: "same words here", confirmPassword: "same words here" }).success).toBe(true);
  });
});
