import "server-only";
import { z } from "zod";
import { updateSchoolSignatory } from "@/db/queries/schools";
import { hasPermission } from "@/lib/auth/permissions";
import type { SessionUser } from "@/lib/auth/session-store";
import { signatorySchema } from "./signatory";

export type SignatoryOutcome = { status: "saved" } | { status: "forbidden" } | { status: "invalid"; error: z.ZodError };

/**
 * An admin names who signs their school's certificates. Certificates issued from now on carry
 * this signatory; those already issued keep the one they were issued with, as a verifier expects
 * a certificate to go on saying what it said on the day.
 */
export async function setSchoolSignatory(params: { admin: SessionUser; input: { signatoryName: unknown; signatoryRole: unknown } }): Promise<SignatoryOutcome> {
  if (!hasPermission(params.admin.role, "certificates:sign")) return { status: "forbidden" };
  const parsed = signatorySchema.safeParse(params.input);
  if (!parsed.success) return { status: "invalid", error: parsed.error };
  await updateSchoolSignatory({ schoolId: params.admin.schoolId, ...parsed.data });
  return { status: "saved" };
}
