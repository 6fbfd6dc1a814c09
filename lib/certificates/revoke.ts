import "server-only";
import { z } from "zod";
import { revokeCertificateInSchool } from "@/db/queries/certificates";
import { hasPermission } from "@/lib/auth/permissions";
import type { SessionUser } from "@/lib/auth/session-store";

export const revokeInputSchema = z.object({
  certificateId: z.uuid({ error: "Choose a certificate to revoke." }),
  reason: z
    .string({ error: "Give the reason for revoking." })
    .trim()
    .min(10, "Give the reason in a sentence (at least 10 characters): it is kept on record.")
    .max(500, "Keep the reason under 500 characters."),
});

export type RevokeOutcome =
  | { status: "revoked" }
  | { status: "forbidden" | "not-found" }
  | { status: "invalid"; error: z.ZodError };

/**
 * An admin revokes a certificate of their own school with a reason. A certificate of another
 * school, or one already revoked, is "not-found": it cannot be revoked from here.
 */
export async function revokeCertificate(params: {
  admin: SessionUser;
  input: { certificateId: unknown; reason: unknown };
  now?: Date;
}): Promise<RevokeOutcome> {
  if (!hasPermission(params.admin.role, "certificates:revoke")) return { status: "forbidden" };
  const parsed = revokeInputSchema.safeParse(params.input);
  if (!parsed.success) return { status: "invalid", error: parsed.error };
  const revoked = await revokeCertificateInSchool({
    certificateId: parsed.data.certificateId,
    schoolId: params.admin.schoolId,
    reason: parsed.data.reason,
    revokedBy: params.admin.id,
    now: params.now ?? new Date(),
  });
  return revoked ? { status: "revoked" } : { status: "not-found" };
}
