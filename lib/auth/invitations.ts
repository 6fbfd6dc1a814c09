import { findCohortInSchool } from "@/db/queries/cohorts";
import {
  acceptInvitation as acceptInvitationRecord,
  createInvitation,
  describeInvitationState,
  findInvitationByTokenHash,
  type InvitationState,
} from "@/db/queries/invitations";
import { findSchoolById } from "@/db/queries/schools";
import { findSchoolUserByEmail } from "@/db/queries/users";
import type { Role } from "@/db/schema";
import { recordLetterOutcomes } from "@/lib/enrolment/letter-outcomes";
import { readAppEnv } from "@/lib/env";
import { sendInvitationEmail } from "@/lib/mail/send";
import { hashPassword } from "./password";
import { createSession, type SessionCookie } from "./session-store";
import { generateToken, hashToken } from "./tokens";

export const invitationLifetimeDays = 7;

export type IssueInvitationResult =
  | { ok: true; invitationId: string; expiresAt: Date }
  | { ok: false; reason: "already-registered" | "unknown-cohort" };

/**
 * Creates an invitation and e-mails its link. The token itself is never stored. Only the school's
 * own accounts are looked at: an address with an account at another school is invited like any
 * new one (its owner, on opening the link, is told to sign in), so the answer reveals nothing.
 */
export async function issueInvitation(params: {
  schoolId: string;
  email: string;
  role: Role;
  cohortId: string | null;
  inviter: { id: string; name: string } | null;
  now?: Date;
}): Promise<IssueInvitationResult> {
  const now = params.now ?? new Date();
  if (await findSchoolUserByEmail({ schoolId: params.schoolId, email: params.email })) return { ok: false, reason: "already-registered" };
  const cohort = params.cohortId ? await findCohortInSchool({ cohortId: params.cohortId, schoolId: params.schoolId }) : null;
  if (params.cohortId && !cohort) return { ok: false, reason: "unknown-cohort" };
  const school = await findSchoolById({ schoolId: params.schoolId });
  if (!school) throw new Error(`School ${params.schoolId} does not exist.`);

  const token = generateToken();
  const expiresAt = new Date(now.getTime() + invitationLifetimeDays * 24 * 60 * 60_000);
  const invitation = await createInvitation({
    schoolId: params.schoolId,
    email: params.email,
    role: params.role,
    cohortId: cohort?.id ?? null,
    invitedById: params.inviter?.id ?? null,
    tokenHash: hashToken(token),
    expiresAt,
  });
  try {
    await sendInvitationEmail({
      schoolId: params.schoolId,
      to: params.email,
      schoolName: school.name,
      cohortName: cohort?.name ?? null,
      inviterName: params.inviter?.name ?? null,
      acceptUrl: `${readAppEnv().APP_URL}/invitations/${token}`,
      expiresAt,
    });
  } catch (error) {
    // The invitation stays in the outbox and is tried again in the background.
    await recordLetterOutcomes({ sentIds: [], unsentIds: [invitation.id], now });
    throw error;
  }
  await recordLetterOutcomes({ sentIds: [invitation.id], unsentIds: [], now });
  return { ok: true, invitationId: invitation.id, expiresAt };
}

export type InvitationPreview =
  | { state: "usable"; email: string; role: Role; schoolName: string; cohortName: string | null }
  | { state: Exclude<InvitationState, "usable"> };

/** What the accept page may show about a link before the person fills in the form. */
export async function previewInvitation(params: { token: string; now?: Date }): Promise<InvitationPreview> {
  const invitation = await findInvitationByTokenHash({ tokenHash: hashToken(params.token) });
  const state = describeInvitationState(invitation, params.now ?? new Date());
  if (state !== "usable" || !invitation) return { state: state === "usable" ? "unknown" : state };
  const { email, role, schoolName, cohortName } = invitation;
  return { state, email, role, schoolName, cohortName };
}

export type AcceptInvitationResult =
  | { ok: true; userId: string; role: Role; cookie: SessionCookie }
  | { ok: false; reason: Exclude<InvitationState, "usable"> | "already-registered" };

/** Sets the invited person's name and password, spends the link and signs them in. */
export async function acceptInvitation(params: {
  token: string;
  name: string;
  password: string;
  now?: Date;
}): Promise<AcceptInvitationResult> {
  const tokenHash = hashToken(params.token);
  const invitation = await findInvitationByTokenHash({ tokenHash });
  const now = params.now ?? new Date();
  const state = describeInvitationState(invitation, now);
  if (state !== "usable" || !invitation) return { ok: false, reason: state === "usable" ? "unknown" : state };

  const result = await acceptInvitationRecord({
    tokenHash,
    name: params.name,
    passwordHash: await hashPassword(params.password),
    now,
  });
  if (!result.ok) return result;
  return { ok: true, userId: result.userId, role: invitation.role, cookie: await createSession(result.userId) };
}
