import { and, eq, sql } from "drizzle-orm";
import { db } from "../client";
import { labDrafts } from "../schema";

/** The learner's saved workbench for a lab, as stored (checked against their variant by lib/lab-drafts). */
export async function findLabDraft(params: { userId: string; labSlug: string }): Promise<{ choices: unknown; answers: unknown; updatedAt: Date } | null> {
  const [row] = await db
    .select({ choices: labDrafts.choices, answers: labDrafts.answers, updatedAt: labDrafts.updatedAt })
    .from(labDrafts)
    .where(and(eq(labDrafts.userId, params.userId), eq(labDrafts.labSlug, params.labSlug)))
    .limit(1);
  return row ?? null;
}

/** Keeps the learner's latest workbench for a lab, replacing the one saved before. */
export async function saveLabDraft(params: { userId: string; labSlug: string; choices: unknown; answers: unknown }): Promise<void> {
  await db
    .insert(labDrafts)
    .values(params)
    .onConflictDoUpdate({
      target: [labDrafts.userId, labDrafts.labSlug],
      set: { choices: params.choices, answers: params.answers, updatedAt: sql`now()` },
    });
}
