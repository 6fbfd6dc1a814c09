import { describe, expect, it } from "vitest";
import { decidePermissionAccess, decideRoleAccess, safeReturnPath, signInPath } from "@/lib/auth/access";

describe("decideRoleAccess", () => {
  it("sends anonymous visitors to sign-in", () => {
    expect(decideRoleAccess(null, ["learner"])).toBe("sign-in");
  });

  it("allows a listed role and forbids the others", () => {
    expect(decideRoleAccess({ role: "admin" }, ["admin"])).toBe("allowed");
    expect(decideRoleAccess({ role: "learner" }, ["admin"])).toBe("forbidden");
    expect(decideRoleAccess({ role: "instructor" }, ["admin", "learner"])).toBe("forbidden");
    expect(decideRoleAccess({ role: "instructor" }, ["admin", "instructor"])).toBe("allowed");
  });
});

describe("decidePermissionAccess", () => {
  it("follows the permission table", () => {
    expect(decidePermissionAccess({ role: "admin" }, "invitations:create")).toBe("allowed");
    expect(decidePermissionAccess({ role: "instructor" }, "invitations:create")).toBe("forbidden");
    expect(decidePermissionAccess({ role: "learner" }, "invitations:create")).toBe("forbidden");
    expect(decidePermissionAccess(null, "invitations:create")).toBe("sign-in");
  });
});

describe("safeReturnPath", () => {
  it("keeps same-site paths with their query", () => {
    expect(safeReturnPath("/cohorts/abc?tab=learners")).toBe("/cohorts/abc?tab=learners");
  });

  it.each([
    ["https://elsewhere.example/x"],
    ["//elsewhere.example/x"],
    ["/\\elsewhere.example"],
    ["javascript:alert(1)"],
    ["admin"],
    ["/ok\nSet-Cookie: x"],
    [""],
    [null],
    [undefined],
  ])("refuses %j", (candidate) => {
    expect(safeReturnPath(candidate)).toBeNull();
  });

  it("builds the sign-in link with an encoded return path, or none", () => {
    expect(signInPath("/cohorts/a b")).toBe("/sign-in?next=%2Fcohorts%2Fa%20b");
    expect(signInPath("//elsewhere.example")).toBe("/sign-in");
    expect(signInPath()).toBe("/sign-in");
  });
});
