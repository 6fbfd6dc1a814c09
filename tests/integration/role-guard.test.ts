import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { decideRoleAccess } from "@/lib/auth/access";
import { protectedRoutes } from "@/lib/auth/route-access";
import { createSession, validateSessionToken } from "@/lib/auth/session-store";
import { createPerson } from "./support/people";

// The guard's view of a session whose account is switched off. Which persona may open which
// route, over HTTP, is the authorization matrix (tests/e2e/authorization-matrix.test.ts).

describe("role guard", () => {
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
