import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import { micrographs, type MicrographRow, type MosaicRow } from "@/db/schema";
import { queueJob, type JobKind } from "./job-queue";
import { mosaicDto, mosaicNeedsStitch, mosaicsOf } from "./mosaics";
import { type Actor, type Db } from "./context";
import { assertMarkupOpen } from "./markup-lock";
import { loadDie, loadDieOf } from "./dies";
import { recordAudit } from "./audit";
import { BadRequestError, ConflictError } from "@/lib/errors";
import { frameFromScale } from "@/lib/geometry/affine";
import { scaleFromCalibration } from "@/lib/micrographs/scale";
import type { MicrographPatch } from "@/lib/validation/micrographs";
import type { TeamAction, TeamRole } from "@/lib/auth/permissions";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { Transform } from "@/lib/geometry/types";

function toDto(r: MicrographRow, role: TeamRole, mosaic?: MosaicRow): MicrographDto {
  return {
    id: r.id,
    dieId: r.dieId,
    label: r.label,
    status: r.status,
    progress: r.progress,
    width: r.width,
    height: r.height,
    scaleUmPerPx: r.scaleUmPerPx,
    illumination: r.illumination,
    objectiveMag: r.objectiveMag,
    numericalAperture: r.numericalAperture,
    cameraPixelPitchUm: r.cameraPixelPitchUm,
    adapterMag: r.adapterMag,
    transform: r.transform ?? null,
    isReference: r.isReference,
    calibration: r.calibration ?? null,
    format: r.format,
    bytes: r.bytes,
    previewWidth: r.previewWidth,
    previewHeight: r.previewHeight,
    position: r.position,
    ...(r.error ? { error: r.error } : {}),
    mosaic: mosaic ? mosaicDto(mosaic, r.status) : null,
    yourRole: role,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

/** Loads a micrograph and checks the caller may do `action` on its die (404 outside the team). */
export async function loadMicrograph(db: Db, actor: Actor, id: string, action: TeamAction) {
  const [row] = await db.select().from(micrographs).where(eq(micrographs.id, id));
  const { die } = await loadDieOf(db, actor, row, action, "That micrograph");
  return { row, die, dto: toDto(row, die.role) };
}

/** One micrograph as the caller may see it. */
export async function getMicrograph(db: Db, actor: Actor, id: string): Promise<MicrographDto> {
  const { row, die } = await loadMicrograph(db, actor, id, "read");
  return toDto(row, die.role, (await mosaicsOf(db, [id])).get(id));
}

/** A die's micrographs in display order. */
export async function listMicrographs(db: Db, actor: Actor, dieId: string): Promise<MicrographDto[]> {
  const { role } = await loadDie(db, actor, dieId, "read");
  const rows = await db.select().from(micrographs).where(eq(micrographs.dieId, dieId)).orderBy(asc(micrographs.position), asc(micrographs.createdAt));
  const mosaics = await mosaicsOf(
    db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => toDto(r, role, mosaics.get(r.id)));
}

export type NewMicrograph = {
  id: string;
  label: string;
  illumination: MicrographRow["illumination"];
  objectiveMag?: number;
  numericalAperture?: number;
  cameraPixelPitchUm?: number;
  adapterMag?: number;
  scaleUmPerPx: number | null;
  width: number;
  height: number;
  format: string;
  bytes: number;
  storedName: string;
  originalName: string;
};

/**
 * Records an accepted upload and queues its tiling job, in the caller's transaction. The first
 * micrograph of a die becomes the reference that defines the die frame: µm from its scale,
 * y flipped, origin at its lower-left pixel corner until a die outline says otherwise. A mosaic
 * queues its stitch job instead (which queues the tiling when the image is composed).
 */
export async function insertMicrograph(db: Db, actor: Actor, dieId: string, m: NewMicrograph, job: JobKind = "tile"): Promise<MicrographRow> {
  const { teamId } = await loadDie(db, actor, dieId, "edit");
  const [{ n }] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(micrographs)
    .where(eq(micrographs.dieId, dieId));
  const isReference = n === 0;
  const transform = isReference && m.scaleUmPerPx ? (frameFromScale(m.scaleUmPerPx, m.height) as Transform) : null;
  const [row] = await db
    .insert(micrographs)
    .values({ ...m, dieId, isReference, transform, position: n, status: "queued", progress: 0, createdBy: actor.userId })
    .returning();
  await queueJob(db, job, row.id);
  await recordAudit(db, actor, { teamId, action: "micrograph.uploaded", entityType: "micrograph", entityId: row.id, dieId, after: row });
  return row;
}

/** Renames a micrograph or sets its scale (typed or by two-point calibration). */
export async function updateMicrograph(db: Db, actor: Actor, id: string, patch: MicrographPatch): Promise<MicrographDto> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadMicrograph(tx, actor, id, "edit");
    const changes: Partial<MicrographRow> = { updatedAt: new Date() };
    if (patch.label) changes.label = patch.label;
    let scale: number | undefined = patch.scaleUmPerPx;
    if (patch.calibration) {
      const { p1, p2, lengthUm } = patch.calibration;
      if (row.width && row.height && [p1, p2].some(([x, y]) => x < 0 || y < 0 || x > row.width! || y > row.height!)) {
        throw new BadRequestError("Calibration points must lie on the image.");
      }
      try {
        scale = scaleFromCalibration(p1, p2, lengthUm);
      } catch (e) {
        throw new BadRequestError(`Calibration refused: ${(e as Error).message}.`);
      }
      changes.calibration = patch.calibration;
    }
    if (scale !== undefined) {
      // A new scale on the reference re-places the die frame the markup is read in.
      if (row.isReference) await assertMarkupOpen(tx, row.dieId);
      changes.scaleUmPerPx = scale;
      if (row.isReference && row.height) changes.transform = frameFromScale(scale, row.height) as Transform;
    }
    const [after] = await tx.update(micrographs).set(changes).where(eq(micrographs.id, id)).returning();
    await recordAudit(tx, actor, {
      teamId: die.teamId,
      action: "micrograph.updated",
      entityType: "micrograph",
      entityId: id,
      dieId: row.dieId,
      before: row,
      after,
    });
  });
  return getMicrograph(db, actor, id);
}

/** Deletes a micrograph row (a tiling job still queued finds it gone and ends); the caller removes its files after the commit. */
export async function deleteMicrograph(db: Db, actor: Actor, id: string): Promise<MicrographRow> {
  return db.transaction(async (tx) => {
    const { row, die } = await loadMicrograph(tx, actor, id, "edit");
    if (row.isReference) await assertMarkupOpen(tx, row.dieId);
    await tx.delete(micrographs).where(eq(micrographs.id, id));
    if (row.isReference) {
      // The next micrograph in order takes over as reference, keeping its own transform.
      const [next] = await tx.select().from(micrographs).where(eq(micrographs.dieId, row.dieId)).orderBy(asc(micrographs.position)).limit(1);
      if (next) await tx.update(micrographs).set({ isReference: true }).where(eq(micrographs.id, next.id));
    }
    await recordAudit(tx, actor, { teamId: die.teamId, action: "micrograph.deleted", entityType: "micrograph", entityId: id, dieId: row.dieId, before: row });
    return row;
  });
}

/**
 * Queues a failed micrograph for tiling again with fresh attempts (owner/analyst); 409 when it
 * has not failed. Its original is kept on failure, so nothing needs uploading again.
 */
export async function retryTiling(db: Db, actor: Actor, id: string): Promise<MicrographDto> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadMicrograph(tx, actor, id, "edit");
    if (row.status !== "failed") throw new ConflictError(`Only a failed micrograph can be tiled again; this one is ${row.status}.`);
    await queueJob(tx, (await mosaicNeedsStitch(tx, id)) ? "stitch" : "tile", id);
    const [after] = await tx
      .update(micrographs)
      .set({ status: "queued", progress: 0, error: null, updatedAt: new Date() })
      .where(eq(micrographs.id, id))
      .returning();
    await recordAudit(tx, actor, {
      teamId: die.teamId,
      action: "micrograph.retried",
      entityType: "micrograph",
      entityId: id,
      dieId: row.dieId,
      before: row,
      after,
    });
  });
  return getMicrograph(db, actor, id);
}
