import type { RosterInvitation, RosterMember } from "@/db/queries/enrolment";

// Where each person in a cohort stands, from their account and their newest invitation. Pure, so
// the rules are tested without a database.

export type RosterState = "accepted" | "deactivated" | "unsent" | "pending" | "expired" | "revoked" | "not-invited";

export type RosterLine = {
  key: string;
  userId: string | null;
  invitationId: string | null;
  name: string | null;
  email: string;
  state: RosterState;
  expiresAt: Date | null;
};

export const rosterStateLabels: Record<RosterState, string> = {
  accepted: "Accepted",
  deactivated: "Deactivated",
  unsent: "E-mail not sent yet",
  pending: "Invitation pending",
  expired: "Invitation expired",
  revoked: "Invitation revoked",
  "not-invited": "Not invited",
};

function invitationState(invitation: RosterInvitation | undefined, now: Date): RosterState {
  if (!invitation) return "not-invited";
  if (invitation.usedAt) return "accepted";
  if (invitation.revokedAt) return "revoked";
  if (invitation.expiresAt <= now) return "expired";
  return invitation.mailPendingSince ? "unsent" : "pending";
}

export function buildRoster(members: readonly RosterMember[], invitations: readonly RosterInvitation[], now: Date): RosterLine[] {
  const invitationByEmail = new Map(invitations.map((invitation) => [invitation.email, invitation]));
  const lines: RosterLine[] = members.map((member) => {
    const invitation = invitationByEmail.get(member.email);
    const state: RosterState = member.awaiting
      ? invitationState(invitation, now)
      : member.active
        ? "accepted"
        : "deactivated";
    return {
      key: member.userId,
      userId: member.userId,
      invitationId: invitation?.id ?? null,
      name: member.name,
      email: member.email,
      state,
      expiresAt: state === "pending" || state === "expired" ? (invitation?.expiresAt ?? null) : null,
    };
  });
  // Invited straight to the cohort without an enrolment row (the school-wide invite form).
  for (const invitation of invitations) {
    if (invitation.hasAccount) continue;
    const state = invitationState(invitation, now);
    lines.push({
      key: invitation.id,
      userId: null,
      invitationId: invitation.id,
      name: null,
      email: invitation.email,
      state,
      expiresAt: state === "pending" || state === "expired" ? invitation.expiresAt : null,
    });
  }
  return lines.sort((a, b) => (a.name ?? a.email).localeCompare(b.name ?? b.email, "en"));
}

export type RosterFilter = { state: RosterState | "all"; query: string };

export function filterRoster(lines: readonly RosterLine[], filter: RosterFilter): RosterLine[] {
  const query = filter.query.trim().toLowerCase();
  return lines.filter(
    (line) =>
      (filter.state === "all" || line.state === filter.state) &&
      (query === "" || line.email.includes(query) || (line.name ?? "").toLowerCase().includes(query)),
  );
}

export function countRosterStates(lines: readonly RosterLine[]): Record<RosterState, number> {
  const counts = { accepted: 0, deactivated: 0, unsent: 0, pending: 0, expired: 0, revoked: 0, "not-invited": 0 };
  for (const line of lines) counts[line.state] += 1;
  return counts;
}
