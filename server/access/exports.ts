import "server-only";
import { and, desc, eq, inArray, lt, sql } from "drizzle-orm";
import { exports as exportsTable, users, type MicrographRow } from "@/db/schema";
import { queueJob } from "./job-queue";
import { type Actor, type Db } from "./context";
import { loadDie, loadDieOf } from "./dies";
import { loadDieMicrograph, loadMarkupExtent, sourceImageOf } from "./export-sources";
import type { ExtentUm } from "@/lib/export/view-region";
import { AppError, BadRequestError, ConflictError, NotFoundError } from "@/lib/errors";
import { planRender, type RenderPlan, type SourceImage } from "@/lib/export/render-plan";
import type { ExportRequest } from "@/lib/validation/exports";
import type { ExportDto, ExportResult } from "@/lib/dto/exports";

type ExportRow = typeof exportsTable.$inferSelect;

/** The stored params: the request as accepted, and the result once rendered. */
export type ExportParams = { request: ExportRequest; result?: ExportResult; warnings?: string[] };

function toDto(row: ExportRow, createdByName: string | null): ExportDto {
  const params = row.params as ExportParams;
  return {
    id: row.id,
    dieId: row.dieId,
    micrographId: row.micrographId,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    request: params.request,
    result: params.result ?? null,
    warnings: params.warnings ?? [],
    fileName: row.fileName,
    bytes: row.bytes,
    error: row.error,
    createdBy: row.createdBy,
    createdByName,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
    fileUrl: row.status === "done" ? `/api/exports/${row.id}/file` : null,
  };
}

/**
 * Checks a request can be rendered before a job is queued (so bad ones answer 400 at once),
 * and returns what it resolved: the micrograph, its place in the die frame and the plan.
 */
export function checkRenderable(
  m: MicrographRow | null,
  die: { widthUm: number | null; heightUm: number | null; extentUm: ExtentUm | null },
  req: ExportRequest,
): { m: MicrographRow; image: SourceImage; plan: RenderPlan } {
  if (!m) throw new NotFoundError("That micrograph");
  if (m.status === "failed" || !m.format) throw new ConflictError("That micrograph failed to process; upload it again before exporting.");
  const image = sourceImageOf(m);
  if (!image) throw new ConflictError("That micrograph is not in the die frame yet: set its scale or align it to the reference, then export.");
  const planned = planRender(image, die, req);
  if (!planned.ok) throw new BadRequestError(planned.message);
  return { m, image, plan: planned.plan };
}

/** How many exports may wait or render at once, per person and per die. */
export type ExportQuota = { perUser: number; perDie: number };

const PENDING = ["queued", "running"] as const;

async function pendingCount(db: Db, where: ReturnType<typeof eq>): Promise<number> {
  const [{ n }] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(exportsTable)
    .where(and(where, inArray(exportsTable.status, [...PENDING])));
  return n;
}

/**
 * 429 when the caller, or the die, already has as many pending exports as the quota allows.
 * Advisory locks on the user and the die (taken in that order) make the count and the insert
 * one step, so parallel requests cannot all pass the same count.
 */
async function assertExportQuota(db: Db, actor: Actor, dieId: string, quota: ExportQuota): Promise<void> {
  await db.execute(sql`select pg_advisory_xact_lock(hashtext(${`export-user:${actor.userId}`}))`);
  await db.execute(sql`select pg_advisory_xact_lock(hashtext(${`export-die:${dieId}`}))`);
  const mine = await pendingCount(db, eq(exportsTable.createdBy, actor.userId));
  if (mine >= quota.perUser) {
    throw new AppError(429, `You already have ${mine} exports waiting or rendering (at most ${quota.perUser}): wait for one to finish, then export again.`);
  }
  const die = await pendingCount(db, eq(exportsTable.dieId, dieId));
  if (die >= quota.perDie) {
    throw new AppError(429, `This die already has ${die} exports waiting or rendering (at most ${quota.perDie}): wait for one to finish, then export again.`);
  }
}

/**
 * Queues an annotated PNG export of a die (any member: viewers may export). The plan and the
 * quota are checked first; the export row and its job are written in one transaction.
 */
export async function createExport(db: Db, actor: Actor, dieId: string, req: ExportRequest, quota: ExportQuota): Promise<ExportDto> {
  return db.transaction(async (tx) => {
    const { row: die } = await loadDie(tx, actor, dieId, "export");
    await assertExportQuota(tx, actor, dieId, quota);
    const extentUm = await loadMarkupExtent(tx, dieId);
    const warnings = [...checkRenderable(await loadDieMicrograph(tx, dieId, req.micrographId), { ...die, extentUm }, req).plan.warnings];
    const params: ExportParams = { request: req, warnings };
    const [row] = await tx
      .insert(exportsTable)
      .values({ dieId, micrographId: req.micrographId, kind: "annotated_png", params, createdBy: actor.userId })
      .returning();
    await queueJob(tx, "export", row.id);
    const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
    return toDto(row, me?.name ?? null);
  });
}

/** Loads an export and checks the caller may see its die (404 outside the team). */
export async function loadExport(db: Db, actor: Actor, id: string) {
  const [found] = await db
    .select({ row: exportsTable, name: users.name })
    .from(exportsTable)
    .leftJoin(users, eq(users.id, exportsTable.createdBy))
    .where(eq(exportsTable.id, id));
  const { row } = await loadDieOf(db, actor, found?.row, "export", "That export");
  return { row, dto: toDto(row, found?.name ?? null) };
}

/** A die's most recent exports (newest first), for downloading again. */
export async function listExports(db: Db, actor: Actor, dieId: string, limit = 20): Promise<ExportDto[]> {
  await loadDie(db, actor, dieId, "export");
  const rows = await db
    .select({ row: exportsTable, name: users.name })
    .from(exportsTable)
    .leftJoin(users, eq(users.id, exportsTable.createdBy))
    .where(eq(exportsTable.dieId, dieId))
    .orderBy(desc(exportsTable.createdAt))
    .limit(limit);
  return rows.map((r) => toDto(r.row, r.name));
}

/**
 * Deletes finished exports (done or failed) older than `olderThan`; returns the deleted rows so
 * the caller removes their files. No caller: the export kind's housekeeping sweep.
 */
export async function expireExports(db: Db, olderThan: Date): Promise<{ id: string; dieId: string }[]> {
  return db
    .delete(exportsTable)
    .where(and(inArray(exportsTable.status, ["done", "failed"]), lt(exportsTable.finishedAt, olderThan)))
    .returning({ id: exportsTable.id, dieId: exportsTable.dieId });
}
