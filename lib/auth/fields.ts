import { z } from "zod";

// Shared rules for the values people type into the sign-in, invitation and reset forms.

export const emailSchema = z
  .string({ error: "Enter your e-mail address." })
  .trim()
  .toLowerCase()
  .min(1, "Enter your e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email("Enter a valid e-mail address, like name@example.com."));

export const passwordLimits = { min: 10, max: 200 } as const;

export const newPasswordSchema = z
  .string({ error: "Choose a password." })
  .min(passwordLimits.min, `Use at least ${passwordLimits.min} characters.`)
  .max(passwordLimits.max, `Use at most ${passwordLimits.max} characters.`)
  .refine((value) => value.trim().length > 0, "A password cannot be only spaces.");

export const personNameSchema = z
  .string({ error: "Enter your name." })
  .trim()
  .min(1, "Enter your name.")
  .max(120, "Use at most 120 characters.");

export const tokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This link is not valid.");

/** Adds the "type it twice" rule to a form schema that has password and confirmPassword. */
export function withMatchingPasswords<T extends z.ZodType<{ password: string; confirmPassword: string }>>(schema: T) {
  return schema.refine((value) => value.password === value.confirmPassword, {
    message: "The two passwords are not the same.",
    path: ["confirmPassword"],
  });
}
