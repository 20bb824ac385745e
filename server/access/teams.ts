import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { memberships, teams, users } from "@/db/schema";
import { authorize, type Actor, type Db } from "./context";
import { recordAudit } from "./audit";
import { ConflictError, NotFoundError } from "@/lib/errors";
import type { TeamRole } from "@/lib/auth/permissions";
import { endSessions } from "./sessions";
import type { MeDto, MemberDto } from "@/lib/dto/teams";

/** The caller and the teams they belong to, with their role in each. */
export async function getMe(db: Db, actor: Actor): Promise<MeDto> {
  const [user] = await db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, actor.userId));
  if (!user) throw new NotFoundError("Your account");
  const rows = await db
    .select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, actor.userId))
    .orderBy(asc(teams.name));
  return { user, teams: rows };
}

/** A team's name and the caller's role in it. */
export async function getTeam(db: Db, actor: Actor, teamId: string): Promise<{ id: string; name: string; yourRole: TeamRole }> {
  const role = await authorize(db, actor, teamId, "read", "That team");
  const [team] = await db.select().from(teams).where(eq(teams.id, teamId));
  return { id: team.id, name: team.name, yourRole: role };
}

/** Members of a team (any member may see who is in it). */
export async function listMembers(db: Db, actor: Actor, teamId: string): Promise<MemberDto[]> {
  await authorize(db, actor, teamId, "read", "That team");
  const rows = await db
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(asc(users.name));
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

async function ownerCount(db: Db, teamId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "owner")));
  return row.n;
}

async function loadMembership(db: Db, teamId: string, userId: string) {
  const [row] = await db
    .select()
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
  if (!row) throw new NotFoundError("That member");
  return row;
}

/**
 * Changes a member's role (owner only); the last owner cannot be demoted. Sessions go on: the
 * role is read from the database on every request, so the new one applies at once.
 */
export async function changeRole(db: Db, actor: Actor, teamId: string, userId: string, role: TeamRole): Promise<MemberDto> {
  await db.transaction(async (tx) => {
    await authorize(tx, actor, teamId, "manage_team", "That team");
    const before = await loadMembership(tx, teamId, userId);
    if (before.role === "owner" && role !== "owner" && (await ownerCount(tx, teamId)) <= 1) {
      throw new ConflictError("The last owner of a team cannot be demoted: make someone else owner first.");
    }
    const [after] = await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
      .returning();
    await recordAudit(tx, actor, { teamId, action: "member.role_changed", entityType: "user", entityId: userId, before, after });
  });
  const members = await listMembers(db, actor, teamId);
  return members.find((m) => m.userId === userId)!;
}

/** Removes a member from a team (owner only; their sessions end); the last owner cannot be removed. */
export async function removeMember(db: Db, actor: Actor, teamId: string, userId: string): Promise<void> {
  await db.transaction(async (tx) => {
    await authorize(tx, actor, teamId, "manage_team", "That team");
    const before = await loadMembership(tx, teamId, userId);
    if (before.role === "owner" && (await ownerCount(tx, teamId)) <= 1) {
      throw new ConflictError("The last owner of a team cannot be removed.");
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await recordAudit(tx, actor, { teamId, action: "member.removed", entityType: "user", entityId: userId, before });
    await endSessions(tx, userId);
  });
}
