import type { Role } from "@/db/schema";

export type { Role };

// Pages are guarded by role (see route-access.ts); server actions and data functions that change
// things are guarded by permission, so a capability can move between roles here alone.
export type Permission =
  | "invitations:create"
  | "cohorts:manage"
  | "learners:manage"
  | "bench:submit"
  | "bench:review"
  | "certificates:revoke"
  | "certificates:sign";

export const rolePermissions: Record<Role, readonly Permission[]> = {
  learner: ["bench:submit"],
  instructor: ["bench:review"],
  admin: ["invitations:create", "cohorts:manage", "learners:manage", "certificates:revoke", "certificates:sign"],
};

export function hasPermission(role: Role, permission: Permission): boolean {
  return rolePermissions[role].includes(permission);
}

const homePaths: Record<Role, string> = {
  learner: "/learn",
  instructor: "/cohorts",
  admin: "/admin",
};

export function homePathFor(role: Role): string {
  return homePaths[role];
}
