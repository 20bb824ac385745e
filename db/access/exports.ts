import "server-only";
import { desc, eq } from "drizzle-orm";
import { exports as exportsTable, jobs, users, type MicrographRow } from "../schema";
import { type Actor, type Db } from "./context";
import { loadDie, loadDieOf } from "./dies";
import { loadDieMicrograph, loadMarkupExtent, sourceImageOf } from "./export-sources";
import type { ExtentUm } from "@/lib/export/view-region";
import { BadRequestError, ConflictError, NotFoundError } from "@/lib/server/errors";
import { planRender, type RenderPlan, type SourceImage } from "@/lib/export/render-plan";
import type { ExportRequest } from "@/lib/validation/exports";

type ExportRow = typeof exportsTable.$inferSelect;

/** What the renderer wrote back into the export's params once done. */
export type ExportResult = { width: number; height: number; umPerPx: number; warnings: string[]; scaleBar: { lengthUm: number; label: string; px: number; x: number; y: number } };

export type ExportDto = {
  id: string;
  dieId: string;
  micrographId: string | null;
  kind: ExportRow["kind"];
  status: ExportRow["status"];
  progress: number;
  request: ExportRequest;
  result: ExportResult | null;
  warnings: string[];
  fileName: string | null;
  bytes: number | null;
  error: string | null;
  createdBy: string | null;
  createdByName: string | null;
  createdAt: string;
  finishedAt: string | null;
  fileUrl: string | null;
};

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
export function checkRenderable(m: MicrographRow | null, die: { widthUm: number | null; heightUm: number | null; extentUm: ExtentUm | null }, req: ExportRequest): { m: MicrographRow; image: SourceImage; plan: RenderPlan } {
  if (!m) throw new NotFoundError("That micrograph");
  if (m.status === "failed" || !m.format) throw new ConflictError("That micrograph failed to process; upload it again before exporting.");
  const image = sourceImageOf(m);
  if (!image) throw new ConflictError("That micrograph is not in the die frame yet: set its scale or align it to the reference, then export.");
  const planned = planRender(image, die, req);
  if (!planned.ok) throw new BadRequestError(planned.message);
  return { m, image, plan: planned.plan };
}

/**
 * Queues an annotated PNG export of a die (any member: viewers may export). The plan is checked
 * first; the export row and its job are written in one transaction.
 */
export async function createExport(db: Db, actor: Actor, dieId: string, req: ExportRequest): Promise<ExportDto> {
  return db.transaction(async (tx) => {
    const { row: die } = await loadDie(tx, actor, dieId, "export");
    const extentUm = await loadMarkupExtent(tx, dieId);
    const warnings = [...checkRenderable(await loadDieMicrograph(tx, dieId, req.micrographId), { ...die, extentUm }, req).plan.warnings];
    const params: ExportParams = { request: req, warnings };
    const [row] = await tx.insert(exportsTable).values({ dieId, micrographId: req.micrographId, kind: "annotated_png", params, createdBy: actor.userId }).returning();
    await tx.insert(jobs).values({ kind: "export", subjectId: row.id });
    const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
    return toDto(row, me?.name ?? null);
  });
}

/** Loads an export and checks the caller may see its die (404 outside the team). */
export async function loadExport(db: Db, actor: Actor, id: string) {
  const [found] = await db.select({ row: exportsTable, name: users.name }).from(exportsTable).leftJoin(users, eq(users.id, exportsTable.createdBy)).where(eq(exportsTable.id, id));
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
