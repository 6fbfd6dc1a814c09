import { findCohortInSchool } from "@/db/queries/cohorts";
import { isUniqueViolation } from "@/db/queries/admin-cohorts";
import { addLearnerToCohort, findRosterConflicts, findSchoolAccount, insertEnrolments } from "@/db/queries/enrolment";
import { findSchoolById } from "@/db/queries/schools";
import type { Actor } from "./actor";
import { invitationExpiry, issueToken } from "./invitation-tokens";
import { sendInvitationLetters, type LetterOutcome } from "./send-invitations";

export type EnrolLearnerResult =
  | { ok: true; outcome: "invited"; letters: LetterOutcome }
  | { ok: true; outcome: "added-existing" }
  | { ok: false; reason: "unknown-cohort" | "already-in-cohort" | "not-a-learner" | "enrolled-meanwhile" | "already-invited" };

/**
 * Enrols one person: a learner of the school joins the cohort straight away; an address new to
 * the school gets an account waiting for them, the membership and an e-mailed invitation, whether
 * or not it has an account at another school (its owner then cannot accept, and is told to sign
 * in), so that the answer never tells one school about another's people.
 */
export async function enrolLearner(params: {
  actor: Actor;
  cohortId: string;
  name: string;
  email: string;
  now?: Date;
}): Promise<EnrolLearnerResult> {
  const now = params.now ?? new Date();
  const { schoolId } = params.actor;
  const cohort = await findCohortInSchool({ cohortId: params.cohortId, schoolId });
  if (!cohort) return { ok: false, reason: "unknown-cohort" };

  const account = await findSchoolAccount({ schoolId, cohortId: cohort.id, email: params.email });
  if (account?.inCohort) return { ok: false, reason: "already-in-cohort" };
  if (account && account.role !== "learner") return { ok: false, reason: "not-a-learner" };
  if (account) {
    await addLearnerToCohort({ schoolId, cohortId: cohort.id, userId: account.id });
    return { ok: true, outcome: "added-existing" };
  }
  const conflicts = await findRosterConflicts({ schoolId, cohortId: cohort.id, emails: [params.email], now });
  if (conflicts.invited.length > 0) return { ok: false, reason: "already-invited" };

  const { token, tokenHash } = issueToken();
  const expiresAt = invitationExpiry(now);
  let invitationIds: Map<string, string>;
  try {
    ({ invitationIds } = await insertEnrolments({
      schoolId,
      cohortId: cohort.id,
      invitedById: params.actor.id,
      expiresAt,
      people: [{ name: params.name, email: params.email, tokenHash }],
    }));
  } catch (error) {
    // Someone at the school enrolled the address between the checks above and this insert.
    if (isUniqueViolation(error, "users_school_email_unique")) return { ok: false, reason: "enrolled-meanwhile" };
    throw error;
  }
  const school = await findSchoolById({ schoolId });
  const letters = await sendInvitationLetters({
    schoolId,
    schoolName: school?.name ?? "your school",
    inviterName: params.actor.name,
    letters: [{ invitationId: invitationIds.get(params.email)!, to: params.email, token, cohortName: cohort.name, expiresAt }],
  });
  return { ok: true, outcome: "invited", letters };
}
