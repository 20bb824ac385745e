import "server-only";
import { and, eq } from "drizzle-orm";
import { memberships } from "@/db/schema";
import type { Actor, Db } from "./context";
import { ForbiddenError } from "@/lib/errors";

/** The teams the caller owns; 403 when none (the mailbox and mail failures are for owners). */
export async function requireOwnedTeams(db: Db, actor: Actor): Promise<string[]> {
  const rows = await db
    .select({ teamId: memberships.teamId })
    .from(memberships)
    .where(and(eq(memberships.userId, actor.userId), eq(memberships.role, "owner")));
  if (rows.length === 0) throw new ForbiddenError("Only a team owner can read the mailbox.");
  return rows.map((r) => r.teamId);
}
