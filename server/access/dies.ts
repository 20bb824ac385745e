import "server-only";
import { asc, eq } from "drizzle-orm";
import { cases, dies, users, type DieRow } from "@/db/schema";
import { authorize, type Actor, type Db } from "./context";
import { loadCase } from "./cases";
import { recordAudit } from "./audit";
import { NotFoundError } from "@/lib/errors";
import type { DiePatch } from "@/lib/validation/dies";
import type { TeamAction, TeamRole } from "@/lib/auth/permissions";
import type { DieDto } from "@/lib/dto/dies";

function toDto(row: DieRow, c: { title: string; teamId: string }, analystName: string | null, role: TeamRole): DieDto {
  return {
    id: row.id,
    caseId: row.caseId,
    caseTitle: c.title,
    teamId: c.teamId,
    name: row.name,
    widthUm: row.widthUm,
    heightUm: row.heightUm,
    notes: row.notes,
    analystId: row.analystId,
    analystName,
    reviewStatus: row.reviewStatus,
    revision: row.revision,
    yourRole: role,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Loads a die with its case and checks the caller may do `action` (404 outside the team). */
export async function loadDie(db: Db, actor: Actor, dieId: string, action: TeamAction) {
  const [found] = await db
    .select({ die: dies, caseTitle: cases.title, teamId: cases.teamId, analystName: users.name })
    .from(dies)
    .innerJoin(cases, eq(cases.id, dies.caseId))
    .leftJoin(users, eq(users.id, dies.analystId))
    .where(eq(dies.id, dieId));
  if (!found) throw new NotFoundError("That die");
  const role = await authorize(db, actor, found.teamId, action, "That die");
  return { row: found.die, teamId: found.teamId, role, dto: toDto(found.die, { title: found.caseTitle, teamId: found.teamId }, found.analystName, role) };
}

/**
 * Authorizes `action` on the die a child row (shape, micrograph, thread, export) belongs to. A
 * missing row, a missing die and a die outside the caller's teams all answer the same 404,
 * named after the child, so nothing tells them apart.
 */
export async function loadDieOf<T extends { dieId: string }>(db: Db, actor: Actor, row: T | undefined, action: TeamAction, what: string) {
  if (!row) throw new NotFoundError(what);
  try {
    return { row, die: await loadDie(db, actor, row.dieId, action) };
  } catch (e) {
    throw e instanceof NotFoundError ? new NotFoundError(what) : e;
  }
}

/** One die as the caller may see it. */
export async function getDie(db: Db, actor: Actor, dieId: string): Promise<DieDto> {
  return (await loadDie(db, actor, dieId, "read")).dto;
}

/** The dies of a case, in creation order. */
export async function listDies(db: Db, actor: Actor, caseId: string): Promise<DieDto[]> {
  const { row: c, role } = await loadCase(db, actor, caseId, "read");
  const rows = await db
    .select({ die: dies, analystName: users.name })
    .from(dies)
    .leftJoin(users, eq(users.id, dies.analystId))
    .where(eq(dies.caseId, caseId))
    .orderBy(asc(dies.createdAt));
  return rows.map((r) => toDto(r.die, c, r.analystName, role));
}

/** Adds a die to a case; its creator becomes its analyst (owner/analyst). */
export async function createDie(
  db: Db,
  actor: Actor,
  caseId: string,
  input: { name: string; widthUm: number | null; heightUm: number | null; notes: string },
): Promise<DieDto> {
  const id = await db.transaction(async (tx) => {
    const { row: c } = await loadCase(tx, actor, caseId, "edit");
    const [row] = await tx
      .insert(dies)
      .values({ ...input, caseId, analystId: actor.userId, createdBy: actor.userId })
      .returning();
    await recordAudit(tx, actor, { teamId: c.teamId, action: "die.created", entityType: "die", entityId: row.id, dieId: row.id, after: row });
    return row.id;
  });
  return getDie(db, actor, id);
}

/** Changes a die's name, size or notes (owner/analyst). */
export async function updateDie(db: Db, actor: Actor, dieId: string, patch: DiePatch): Promise<DieDto> {
  await db.transaction(async (tx) => {
    const { row, teamId } = await loadDie(tx, actor, dieId, "edit");
    const [after] = await tx
      .update(dies)
      .set({ ...patch, updatedAt: new Date() })
      .where(eq(dies.id, dieId))
      .returning();
    await recordAudit(tx, actor, { teamId, action: "die.updated", entityType: "die", entityId: dieId, dieId, before: row, after });
  });
  return getDie(db, actor, dieId);
}

/** Deletes a die (owner/analyst); files are removed by the caller after the commit. */
export async function deleteDie(db: Db, actor: Actor, dieId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const { row, teamId } = await loadDie(tx, actor, dieId, "edit");
    await tx.delete(dies).where(eq(dies.id, dieId));
    await recordAudit(tx, actor, { teamId, action: "die.deleted", entityType: "die", entityId: dieId, dieId, before: row });
  });
}
