import { describe, expect, it } from "vitest";
import type { RosterInvitation, RosterMember } from "@/db/queries/enrolment";
import { buildRoster, countRosterStates, filterRoster } from "@/lib/enrolment/roster-status";

const now = new Date("2026-03-10T12:00:00Z");
const later = new Date("2026-03-15T12:00:00Z");
const earlier = new Date("2026-03-01T12:00:00Z");

function member(name: string, fields: Partial<RosterMember> = {}): RosterMember {
  const email = `${name.toLowerCase()}@school.example`;
  return { userId: `user-${name}`, name, email, active: true, awaiting: false, ...fields };
}

function invitation(email: string, fields: Partial<RosterInvitation> = {}): RosterInvitation {
  return { id: `inv-${email}`, email, expiresAt: later, usedAt: null, revokedAt: null, createdAt: earlier, mailPendingSince: null, hasAccount: true, ...fields };
}

describe("where each person in a cohort stands", () => {
  it("reads accounts and their newest invitation", () => {
    const roster = buildRoster(
      [
        member("Ada"),
        member("Bo", { active: false }),
        member("Cy", { active: false, awaiting: true }),
        member("Di", { active: false, awaiting: true }),
        member("Ed", { active: false, awaiting: true }),
        member("Fay", { active: false, awaiting: true }),
      ],
      [
        invitation("ada@school.example", { usedAt: earlier }),
        invitation("cy@school.example"),
        invitation("di@school.example", { expiresAt: now }),
        invitation("ed@school.example", { revokedAt: earlier }),
      ],
      now,
    );
    expect(roster.map((line) => [line.name, line.state, line.invitationId !== null])).toEqual([
      ["Ada", "accepted", true],
      ["Bo", "deactivated", false],
      ["Cy", "pending", true],
      ["Di", "expired", true],
      ["Ed", "revoked", true],
      ["Fay", "not-invited", false],
    ]);
    expect(roster.find((line) => line.name === "Cy")?.expiresAt).toEqual(later);
    expect(roster.find((line) => line.name === "Ed")?.expiresAt).toBeNull();
  });

  it("tells an open link whose e-mail has not gone out from one that was sent", () => {
    const roster = buildRoster(
      [member("Gus", { active: false, awaiting: true }), member("Hal", { active: false, awaiting: true })],
      [invitation("gus@school.example", { mailPendingSince: earlier }), invitation("hal@school.example", { mailPendingSince: earlier, expiresAt: now })],
      now,
    );
    expect(roster.map((line) => [line.name, line.state])).toEqual([
      ["Gus", "unsent"],
      ["Hal", "expired"],
    ]);
    expect(countRosterStates(roster)).toMatchObject({ unsent: 1, pending: 0, expired: 1 });
  });

  it("lists an invitation to the cohort whose person has no account yet", () => {
    const roster = buildRoster([], [invitation("new@school.example", { hasAccount: false })], now);
    expect(roster).toEqual([
      { key: "inv-new@school.example", userId: null, invitationId: "inv-new@school.example", name: null, email: "new@school.example", state: "pending", expiresAt: later },
    ]);
  });

  it("filters by state and by a piece of name or address, and counts states", () => {
    const roster = buildRoster(
      [member("Ada"), member("Bo", { active: false }), member("Cy", { active: false, awaiting: true })],
      [invitation("cy@school.example")],
      now,
    );
    expect(filterRoster(roster, { state: "pending", query: "" }).map((line) => line.name)).toEqual(["Cy"]);
    expect(filterRoster(roster, { state: "all", query: " BO@" }).map((line) => line.name)).toEqual(["Bo"]);
    expect(filterRoster(roster, { state: "accepted", query: "cy" })).toEqual([]);
    expect(countRosterStates(roster)).toMatchObject({ accepted: 1, deactivated: 1, pending: 1, expired: 0 });
  });
});
