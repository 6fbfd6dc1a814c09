import { z } from "zod";

/** Who signs a school's certificates: a person's name and their role at the school. */
export type Signatory = { name: string; role: string };

// Printed on a PDF and a public page: one line each, no control characters, a sensible length.
const printedLine = (what: string) =>
  z
    .string({ error: `Enter the ${what}.` })
    .transform((value) => value.normalize("NFC").replace(/\s+/g, " ").trim())
    .pipe(
      z
        .string()
        .min(2, `Enter the ${what}.`)
        .max(80, `Keep the ${what} to 80 characters.`)
        .refine((value) => !/\p{Cc}/u.test(value), `The ${what} cannot hold control characters.`),
    );

export const signatorySchema = z.object({
  signatoryName: printedLine("signatory's name"),
  signatoryRole: printedLine("signatory's role"),
});

/** A certificate's or a school's two columns as one signatory, or null when none was named. */
export function signatoryOf(row: { signatoryName: string | null; signatoryRole: string | null }): Signatory | null {
  return row.signatoryName && row.signatoryRole ? { name: row.signatoryName, role: row.signatoryRole } : null;
}
