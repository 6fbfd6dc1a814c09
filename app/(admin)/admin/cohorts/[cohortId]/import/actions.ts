"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requirePermission } from "@/lib/auth/current-user";
import { describeUnsent, importRoster, previewRoster, type RosterPreview } from "@/lib/enrolment";
import { describeError } from "@/lib/http/errors";
import { formDataOrEmpty } from "@/lib/http/form-state";

export type RosterImportState =
  | { status: "idle" }
  | { status: "problem"; message: string; preview: RosterPreview | null }
  | { status: "preview"; preview: RosterPreview }
  | { status: "imported"; imported: number; message: string; warning: string | null };

const requestSchema = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("preview"), cohortId: z.uuid() }),
  z.object({ intent: z.literal("import"), cohortId: z.uuid(), expectedValid: z.coerce.number().int().min(0) }),
]);

/**
 * Checks an uploaded roster (intent "preview": nothing is written) or imports its valid rows
 * (intent "import": the same file again, with the count of valid rows the admin saw).
 */
export async function rosterImportAction(_previous: RosterImportState, formData: FormData): Promise<RosterImportState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("learners:manage", { returnTo: "/admin" });
  const request = requestSchema.safeParse({
    intent: formData.get("intent"),
    cohortId: formData.get("cohortId"),
    expectedValid: formData.get("expectedValid") ?? undefined,
  });
  if (!request.success) return { status: "problem", message: "That request could not be read. Reload the page and try again.", preview: null };
  const file = formData.get("file");

  try {
    if (request.data.intent === "preview") {
      const result = await previewRoster({ actor: admin, cohortId: request.data.cohortId, file });
      return result.ok ? { status: "preview", preview: result.preview } : { status: "problem", message: result.problem, preview: null };
    }
    const result = await importRoster({ actor: admin, cohortId: request.data.cohortId, file, expectedValid: request.data.expectedValid });
    if (!result.ok) return { status: "problem", message: result.problem, preview: result.preview ?? null };
    revalidatePath(`/admin/cohorts/${request.data.cohortId}`);
    revalidatePath("/admin");
    const people = result.imported === 1 ? "1 learner" : `${result.imported.toLocaleString("en-GB")} learners`;
    return {
      status: "imported",
      imported: result.imported,
      message: `Imported ${people}. ${result.letters.sent.toLocaleString("en-GB")} invitation e-mail${result.letters.sent === 1 ? " was" : "s were"} sent.`,
      warning: describeUnsent(result.letters),
    };
  } catch (error) {
    return { status: "problem", message: describeError(error).body.error.message, preview: null };
  }
}
