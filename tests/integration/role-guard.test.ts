import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { demoAdmin, demoCohorts, demoLearnerEmail, demoPassword } from "@/db/demo-data";
import { users, type Role } from "@/db/schema";
import { decidePermissionAccess, decideRoleAccess } from "@/lib/auth/access";
import { protectedRoutes, type ProtectedRoute } from "@/lib/auth/route-access";
import { createSession, validateSessionToken, type SessionUser } from "@/lib/auth/session-store";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { createPerson, uniqueAddress } from "./support/people";

// The decision every protected page makes, taken with real sessions of the seeded accounts.
// The expected owner of each route is written out here, independently of the route table.
const owner: Record<ProtectedRoute, readonly Role[]> = {
  "/learn": ["learner"],
  "/lessons/[lessonSlug]": ["learner"],
  "/labs/[labSlug]": ["learner"],
  "/bench/[exerciseSlug]": ["learner"],
  "/certificate": ["learner"],
  "/cohorts": ["instructor"],
  "/cohorts/[cohortId]": ["instructor", "admin"],
  "/cohorts/[cohortId]/learners/[learnerId]": ["instructor", "admin"],
  "/reviews": ["instructor"],
  "/reviews/[submissionId]": ["instructor"],
  "/admin": ["admin"],
  "/certificates": ["admin"],
  "/admin/cohorts/new": ["admin"],
  "/admin/cohorts/[cohortId]": ["admin"],
  "/admin/cohorts/[cohortId]/edit": ["admin"],
  "/admin/cohorts/[cohortId]/import": ["admin"],
  "/dev/mail": ["admin"],
};

const demoEmails: Record<Role, string> = {
  admin: demoAdmin.email,
  instructor: demoCohorts[1].instructor.email,
  learner: demoLearnerEmail(demoCohorts[1].learners[2]),
};

const viewers = {} as Record<Role, SessionUser>;

beforeAll(async () => {
  for (const role of Object.keys(demoEmails) as Role[]) {
    const signedIn = await signInWithPassword({ email: demoEmails[role], password: demoPassword, clientAddress: uniqueAddress() });
    if (!signedIn.ok) throw new Error(`The seeded ${role} could not sign in (${signedIn.reason}).`);
    const session = await validateSessionToken(signedIn.cookie.value);
    if (!session.user) throw new Error(`The ${role} session did not validate.`);
    viewers[role] = session.user;
  }
});

describe("role guard", () => {
  it("has an owner for every protected route", () => {
    expect(Object.keys(protectedRoutes).sort()).toEqual(Object.keys(owner).sort());
  });

  for (const route of Object.keys(owner) as ProtectedRoute[]) {
    describe(route, () => {
      for (const role of ["admin", "instructor", "learner"] as const) {
        const expected = owner[route].includes(role) ? "allowed" : "forbidden";
        it(`${role} → ${expected === "allowed" ? "page" : "403"}`, () => {
          expect(viewers[role].role).toBe(role);
          expect(decideRoleAccess(viewers[role], protectedRoutes[route])).toBe(expected);
        });
      }

      it("anonymous → sign-in", async () => {
        const noSession = await validateSessionToken("not-a-session-token");
        expect(noSession.user).toBeNull();
        expect(decideRoleAccess(noSession.user, protectedRoutes[route])).toBe("sign-in");
      });
    });
  }

  it("lets only admins create invitations", () => {
    expect(decidePermissionAccess(viewers.admin, "invitations:create")).toBe("allowed");
    expect(decidePermissionAccess(viewers.instructor, "invitations:create")).toBe("forbidden");
    expect(decidePermissionAccess(viewers.learner, "invitations:create")).toBe("forbidden");
  });

  it("treats the session of a deactivated account as no session", async () => {
    const person = await createPerson({ role: "admin", password: "soon to be switched off" });
    const cookie = await createSession(person.id);
    expect((await validateSessionToken(cookie.value)).user?.role).toBe("admin");
    await db.update(users).set({ active: false }).where(eq(users.id, person.id));
    const after = await validateSessionToken(cookie.value);
    expect(after.user).toBeNull();
    expect(decideRoleAccess(after.user, protectedRoutes["/admin"])).toBe("sign-in");
  });
});
