import "server-only";
import { and, eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { memberships } from "@/db/schema";
import { can, type TeamAction, type TeamRole } from "@/lib/auth/permissions";
import { ForbiddenError, NotFoundError } from "@/lib/errors";

/** Who is asking. Every data-access function takes one and scopes by it. */
export type Actor = { readonly userId: string };

/** The data-access layer works on any Drizzle database or transaction. */
export type Db = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

/** The caller's role in a team, or null when not a member. */
async function roleIn(db: Db, actor: Actor, teamId: string): Promise<TeamRole | null> {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, actor.userId)));
  return row?.role ?? null;
}

/**
 * The one authorization gate: 404 for non-members (existence is not revealed), 403 for a
 * member whose role lacks the right. Returns the role.
 */
export async function authorize(db: Db, actor: Actor, teamId: string, action: TeamAction, what = "That item"): Promise<TeamRole> {
  const role = await roleIn(db, actor, teamId);
  if (!role) throw new NotFoundError(what);
  if (!can(role, action)) throw new ForbiddenError(forbiddenMessage(role, action));
  return role;
}

function forbiddenMessage(role: TeamRole, action: TeamAction): string {
  const verbs: Record<TeamAction, string> = {
    read: "view this",
    edit: "create or change cases, dies, micrographs or markup",
    comment: "comment",
    decide: "sign off dies or return them with remarks",
    export: "export",
    manage_team: "manage team members",
  };
  return `A ${role} cannot ${verbs[action]} in this team.`;
}
