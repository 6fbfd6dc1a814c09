import type { Role } from "@/db/schema";

export type { Role };

// Route groups are audiences and are guarded by role; actions and data functions are
// capabilities and are guarded by permission, so a capability can move between roles here alone.
export type Permission = "invitations:create" | "dev-mail:read";

export const rolePermissions: Record<Role, readonly Permission[]> = {
  learner: [],
  instructor: [],
  admin: ["invitations:create", "dev-mail:read"],
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
