/**
 * Roles and what each may do. Client-safe: the UI uses `can()` only to hide controls; every loader, action and
 * API route enforces the same table on the server through the guards in app/.server/auth/guards.ts.
 */
export const ROLES = ["viewer", "engineer", "lab_lead", "admin"] as const;
export type Role = (typeof ROLES)[number];

/** How roles are named on screen. */
export const ROLE_LABELS: Record<Role, string> = {
  viewer: "Viewer (read-only)",
  engineer: "Reservoir engineer",
  lab_lead: "Lab lead",
  admin: "Administrator",
};

export type Permission =
  | "read:samples"
  | "export:tables"
  | "read:draft-revisions"
  | "manage:own-tokens"
  | "save:lookup-sets"
  | "edit:samples"
  | "upload:revisions"
  | "review:revisions"
  | "manage:people"
  | "manage:settings"
  | "revoke:any-token"
  | "read:audit-log"
  | "read:captured-mail";

const GRANTS: Record<Permission, readonly Role[]> = {
  "read:samples": ["viewer", "engineer", "lab_lead", "admin"],
  "export:tables": ["engineer", "lab_lead", "admin"],
  // Asked for explicitly (revision=N) in a signed-in session, never with a token; outputs then say "draft".
  "read:draft-revisions": ["engineer", "lab_lead", "admin"],
  "manage:own-tokens": ["engineer", "lab_lead", "admin"],
  "save:lookup-sets": ["engineer", "lab_lead", "admin"],
  "edit:samples": ["lab_lead", "admin"],
  "upload:revisions": ["lab_lead", "admin"],
  "review:revisions": ["lab_lead", "admin"],
  "manage:people": ["admin"],
  "manage:settings": ["admin"],
  "revoke:any-token": ["admin"],
  "read:audit-log": ["admin"],
  "read:captured-mail": ["admin"],
};

export function can(
  user: { role: Role } | null | undefined,
  permission: Permission,
): boolean {
  return !!user && GRANTS[permission].includes(user.role);
}
