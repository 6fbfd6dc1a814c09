import { isUniqueViolation } from "@/db/queries/admin-cohorts";
import { findCohortInSchool } from "@/db/queries/cohorts";
import { findRosterConflicts, insertEnrolments } from "@/db/queries/enrolment";
import { findSchoolById } from "@/db/queries/schools";
import type { Actor } from "./actor";
import { classifyRoster, countRoster, rosterEmails, type ClassifiedRow, type RosterCounts } from "./classify-roster";
import { invitationExpiry, issueToken } from "./invitation-tokens";
import { parseRosterCsv } from "./roster-csv";
import { readRosterFile } from "./roster-file";
import { cohortLetters, sendInvitationLetters, type LetterOutcome } from "./send-invitations";

export type RosterPreview = { fileName: string; rows: ClassifiedRow[]; counts: RosterCounts };

export type PreviewResult = { ok: true; preview: RosterPreview } | { ok: false; problem: string };

export type ImportResult =
  | { ok: true; imported: number; letters: LetterOutcome; timings: { writeMs: number; mailMs: number } }
  | { ok: false; problem: string; preview?: RosterPreview };

async function classifyFile(params: { actor: Actor; cohortId: string; file: unknown; now: Date }) {
  const cohort = await findCohortInSchool({ cohortId: params.cohortId, schoolId: params.actor.schoolId });
  if (!cohort) return { ok: false as const, problem: "That cohort is not part of your school." };
  const read = await readRosterFile(params.file);
  if (!read.ok) return read;
  const parsed = parseRosterCsv(read.text);
  if (!parsed.ok) return parsed;
  const conflicts = await findRosterConflicts({
    schoolId: params.actor.schoolId,
    cohortId: cohort.id,
    emails: rosterEmails(parsed.entries),
    now: params.now,
  });
  const rows = classifyRoster(parsed.entries, {
    inCohort: new Set(conflicts.inCohort),
    inSchool: new Set(conflicts.inSchool),
    invited: new Set(conflicts.invited),
  });
  const preview: RosterPreview = { fileName: read.fileName, rows, counts: countRoster(rows) };
  return { ok: true as const, cohort, preview };
}

/** What importing the file would do, row by row; nothing is written. */
export async function previewRoster(params: { actor: Actor; cohortId: string; file: unknown; now?: Date }): Promise<PreviewResult> {
  const classified = await classifyFile({ ...params, now: params.now ?? new Date() });
  return classified.ok ? { ok: true, preview: classified.preview } : classified;
}

/**
 * Imports the valid rows of the file in one transaction, then e-mails the invitations. The file is
 * classified again here, and the import goes ahead only if it still finds the number of valid rows
 * the admin was shown, so what is written is what was previewed.
 */
export async function importRoster(params: {
  actor: Actor;
  cohortId: string;
  file: unknown;
  expectedValid: number;
  now?: Date;
}): Promise<ImportResult> {
  const now = params.now ?? new Date();
  const classified = await classifyFile({ ...params, now });
  if (!classified.ok) return classified;
  const { cohort, preview } = classified;
  if (preview.counts.valid !== params.expectedValid) {
    return {
      ok: false,
      problem: `The list changed since you checked it: ${preview.counts.valid} rows can be imported now. Look over the new preview, then import again.`,
      preview,
    };
  }
  if (preview.counts.valid === 0) return { ok: false, problem: "No row of this file can be imported.", preview };

  const people = preview.rows
    .filter((row) => row.status === "valid")
    .map((row) => ({ name: row.name, email: row.email, ...issueToken() }));
  const expiresAt = invitationExpiry(now);
  const writeStarted = performance.now();
  let invitationIds: Map<string, string>;
  try {
    ({ invitationIds } = await insertEnrolments({
      schoolId: params.actor.schoolId,
      cohortId: cohort.id,
      invitedById: params.actor.id,
      expiresAt,
      people: people.map(({ name, email, tokenHash }) => ({ name, email, tokenHash })),
    }));
  } catch (error) {
    if (!isUniqueViolation(error, "users_school_email_unique")) throw error;
    const again = await classifyFile({ ...params, now });
    return {
      ok: false,
      problem: "Some of these addresses were enrolled while you were looking at the preview. Nothing was imported: look over the new preview, then import again.",
      preview: again.ok ? again.preview : undefined,
    };
  }
  const writeMs = performance.now() - writeStarted;

  const school = await findSchoolById({ schoolId: params.actor.schoolId });
  const mailStarted = performance.now();
  const letters = await sendInvitationLetters({
    schoolId: params.actor.schoolId,
    schoolName: school?.name ?? "your school",
    inviterName: params.actor.name,
    letters: cohortLetters(people, invitationIds, { cohortName: cohort.name, expiresAt }),
  });
  return { ok: true, imported: people.length, letters, timings: { writeMs, mailMs: performance.now() - mailStarted } };
}
