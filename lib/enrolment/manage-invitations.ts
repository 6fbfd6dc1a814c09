import { findCohortInSchool } from "@/db/queries/cohorts";
import { findInvitationInSchool, listWaitingInvitations, reissueInvitations, revokeInvitation } from "@/db/queries/enrolment";
import { findSchoolById } from "@/db/queries/schools";
import type { Actor } from "./actor";
import { invitationExpiry, issueToken } from "./invitation-tokens";
import { cohortLetters, sendInvitationLetters, type LetterOutcome } from "./send-invitations";

export type ResendResult = { ok: true; letters: LetterOutcome } | { ok: false; reason: "not-found" | "accepted" };

async function schoolName(schoolId: string): Promise<string> {
  return (await findSchoolById({ schoolId }))?.name ?? "your school";
}

/** A new link for the same person; the old one stops working at once. */
export async function resendInvitation(params: { actor: Actor; invitationId: string; now?: Date }): Promise<ResendResult> {
  const now = params.now ?? new Date();
  const invitation = await findInvitationInSchool({ schoolId: params.actor.schoolId, invitationId: params.invitationId });
  if (!invitation) return { ok: false, reason: "not-found" };
  if (invitation.usedAt || invitation.accountJoined) return { ok: false, reason: "accepted" };

  const { token, tokenHash } = issueToken();
  const expiresAt = invitationExpiry(now);
  const invitationIds = await reissueInvitations({
    schoolId: params.actor.schoolId,
    invitedById: params.actor.id,
    expiresAt,
    now,
    items: [{ email: invitation.email, role: invitation.role, cohortId: invitation.cohortId, tokenHash }],
  });
  const letters = await sendInvitationLetters({
    schoolId: params.actor.schoolId,
    schoolName: await schoolName(params.actor.schoolId),
    inviterName: params.actor.name,
    letters: [{ invitationId: invitationIds.get(invitation.email)!, to: invitation.email, token, cohortName: invitation.cohortName, expiresAt }],
  });
  return { ok: true, letters };
}

export type ResendAllResult = { ok: true; reissued: number; letters: LetterOutcome } | { ok: false; reason: "not-found" };

/**
 * New links for everyone in the cohort still waiting (pending or expired, not revoked): the way
 * to catch up after the mail server was down during an import.
 */
export async function resendWaitingInvitations(params: { actor: Actor; cohortId: string; now?: Date }): Promise<ResendAllResult> {
  const now = params.now ?? new Date();
  const cohort = await findCohortInSchool({ cohortId: params.cohortId, schoolId: params.actor.schoolId });
  if (!cohort) return { ok: false, reason: "not-found" };
  const waiting = await listWaitingInvitations({ schoolId: params.actor.schoolId, cohortId: cohort.id });
  const items = waiting.map((invitation) => ({ ...invitation, ...issueToken() }));
  const expiresAt = invitationExpiry(now);
  const invitationIds = await reissueInvitations({
    schoolId: params.actor.schoolId,
    invitedById: params.actor.id,
    expiresAt,
    now,
    items: items.map(({ token: _token, ...item }) => item),
  });
  const letters = await sendInvitationLetters({
    schoolId: params.actor.schoolId,
    schoolName: await schoolName(params.actor.schoolId),
    inviterName: params.actor.name,
    letters: cohortLetters(items, invitationIds, { cohortName: cohort.name, expiresAt }),
  });
  return { ok: true, reissued: items.length, letters };
}

/** Stops an unused link from working; false when there is no such open invitation at the school. */
export function revokeInvitationLink(params: { actor: Actor; invitationId: string; now?: Date }): Promise<boolean> {
  return revokeInvitation({ schoolId: params.actor.schoolId, invitationId: params.invitationId, now: params.now ?? new Date() });
}
