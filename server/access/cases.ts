import "server-only";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { cases, dies, memberships, teams, type CaseRow } from "@/db/schema";
import { authorize, type Actor, type Db } from "./context";
import { recordAudit } from "./audit";
import { NotFoundError } from "@/lib/errors";
import type { CasePatch } from "@/lib/validation/cases";
import type { TeamRole } from "@/lib/auth/permissions";
import type { CaseDto } from "@/lib/dto/cases";

function toDto(row: CaseRow, teamName: string, dieCount: number, role: TeamRole): CaseDto {
  return {
    id: row.id,
    teamId: row.teamId,
    teamName,
    title: row.title,
    partMarking: row.partMarking,
    package: row.package,
    sampleId: row.sampleId,
    notes: row.notes,
    dieCount,
    yourRole: role,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const dieCount = sql<number>`(select count(*)::int from ${dies} where ${dies.caseId} = ${cases.id})`;

/** Cases of every team the caller belongs to, newest first. */
export async function listCases(db: Db, actor: Actor): Promise<CaseDto[]> {
  const rows = await db
    .select({ c: cases, teamName: teams.name, role: memberships.role, dieCount })
    .from(cases)
    .innerJoin(memberships, and(eq(memberships.teamId, cases.teamId), eq(memberships.userId, actor.userId)))
    .innerJoin(teams, eq(teams.id, cases.teamId))
    .orderBy(desc(cases.createdAt));
  return rows.map((r) => toDto(r.c, r.teamName, r.dieCount, r.role));
}

/** Loads a case row and checks the caller may do `action` on it (404 outside the team). */
export async function loadCase(db: Db, actor: Actor, caseId: string, action: Parameters<typeof authorize>[3]) {
  const [row] = await db.select().from(cases).where(eq(cases.id, caseId));
  if (!row) throw new NotFoundError("That case");
  const role = await authorize(db, actor, row.teamId, action, "That case");
  return { row, role };
}

/** One case as the caller may see it. */
export async function getCase(db: Db, actor: Actor, caseId: string): Promise<CaseDto> {
  const { row, role } = await loadCase(db, actor, caseId, "read");
  const [extra] = await db.select({ teamName: teams.name, dieCount }).from(cases).innerJoin(teams, eq(teams.id, cases.teamId)).where(eq(cases.id, caseId));
  return toDto(row, extra.teamName, extra.dieCount, role);
}

/** Creates a case in a team (owner/analyst). */
export async function createCase(
  db: Db,
  actor: Actor,
  teamId: string,
  input: { title: string; partMarking: string; package: string; sampleId: string; notes: string },
): Promise<CaseDto> {
  return db.transaction(async (tx) => {
    const role = await authorize(tx, actor, teamId, "edit", "That team");
    const [row] = await tx
      .insert(cases)
      .values({ ...input, teamId, createdBy: actor.userId })
      .returning();
    await recordAudit(tx, actor, { teamId, action: "case.created", entityType: "case", entityId: row.id, after: row });
    const [team] = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId));
    return toDto(row, team.name, 0, role);
  });
}

/** Changes a case's fields (owner/analyst). */
export async function updateCase(db: Db, actor: Actor, caseId: string, patch: CasePatch): Promise<CaseDto> {
  await db.transaction(async (tx) => {
    const { row } = await loadCase(tx, actor, caseId, "edit");
    const [after] = await tx
      .update(cases)
      .set({ ...patch, updatedAt: new Date() })
      .where(eq(cases.id, caseId))
      .returning();
    await recordAudit(tx, actor, { teamId: row.teamId, action: "case.updated", entityType: "case", entityId: caseId, before: row, after });
  });
  return getCase(db, actor, caseId);
}

/** Deletes a case and, through the foreign keys, its dies (owner/analyst). Returns die ids removed. */
export async function deleteCase(db: Db, actor: Actor, caseId: string): Promise<{ dieIds: string[] }> {
  return db.transaction(async (tx) => {
    const { row } = await loadCase(tx, actor, caseId, "edit");
    const dieRows = await tx.select({ id: dies.id }).from(dies).where(eq(dies.caseId, caseId));
    await tx.delete(cases).where(eq(cases.id, caseId));
    await recordAudit(tx, actor, { teamId: row.teamId, action: "case.deleted", entityType: "case", entityId: caseId, before: row });
    return { dieIds: dieRows.map((d) => d.id) };
  });
}

/** Team ids where the caller may create cases, for the "new case" form. */
export async function teamsWhereCanEdit(db: Db, actor: Actor): Promise<{ id: string; name: string }[]> {
  return db
    .select({ id: teams.id, name: teams.name })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, actor.userId), inArray(memberships.role, ["owner", "analyst"])));
}
