/**
 * The role matrix of the product, in one place. Every server check goes through `can`.
 * Non-members never reach this table: the data-access layer answers 404 for them, so that
 * a team's cases cannot even be probed for existence.
 */
export const ROLES = ["owner", "analyst", "reviewer", "viewer"] as const;
export type TeamRole = (typeof ROLES)[number];

export const ACTIONS = ["read", "edit", "comment", "decide", "export", "manage_team"] as const;
/**
 * - read: see cases, dies, micrographs, markup, threads
 * - edit: create case/die, upload, edit markup, align
 * - comment: comment, reply, resolve
 * - decide: sign off / return with remarks
 * - export: annotated PNG, tables, report
 * - manage_team: invite, change roles, remove members
 */
export type TeamAction = (typeof ACTIONS)[number];

const MATRIX: Record<TeamRole, ReadonlySet<TeamAction>> = {
  owner: new Set(["read", "edit", "comment", "decide", "export", "manage_team"]),
  analyst: new Set(["read", "edit", "comment", "export"]),
  reviewer: new Set(["read", "comment", "decide", "export"]),
  viewer: new Set(["read", "export"]),
};

/** Whether a team member with this role may do this action. */
export function can(role: TeamRole, action: TeamAction): boolean {
  return MATRIX[role].has(action);
}

export const ROLE_LABELS: Record<TeamRole, string> = {
  owner: "Owner",
  analyst: "Analyst",
  reviewer: "Reviewer",
  viewer: "Viewer",
};
