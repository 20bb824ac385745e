import "server-only";
import { eq, inArray } from "drizzle-orm";
import { micrographs, mosaics, type MicrographRow, type MosaicRow } from "@/db/schema";
import type { MosaicDto, MosaicFrameDto, MosaicPairDto, MosaicStage } from "@/lib/dto/micrographs";
import type { Transform } from "@/lib/geometry/types";
import { frameFromScale } from "@/lib/geometry/affine";
import { queueJob } from "./job-queue";
import type { Db } from "./context";

/**
 * The stage the user sees. After the stitch the row says "tiling" and the ordinary tile job
 * moves the micrograph on, so the micrograph's status tells whether tiling ended.
 */
function shownStage(m: MosaicRow, status: MicrographRow["status"]): MosaicStage {
  if (m.restitching) return m.stage;
  if (m.stage === "tiling" && status === "ready") return "done";
  if (m.stage === "tiling" && status === "failed") return "failed";
  return m.stage;
}

/** The API's `mosaic` of a micrograph stitched from frames. */
export function mosaicDto(m: MosaicRow, status: MicrographRow["status"]): MosaicDto {
  return {
    rows: m.rows,
    cols: m.cols,
    order: m.order,
    frameWidth: m.frameWidth,
    frameHeight: m.frameHeight,
    frames: m.frames,
    pairs: m.pairs,
    residualPx: m.residualRmsPx === null || m.residualMaxPx === null ? null : { rms: m.residualRmsPx, max: m.residualMaxPx },
    overlapPercent: m.overlapPercent,
    flatField: m.flatField,
    stage: shownStage(m, status),
    stageProgress: m.stageProgress,
    warnings: m.warnings,
    restitching: m.restitching,
  };
}

/** The mosaic rows of the given micrographs, by micrograph id (most micrographs have none). */
export async function mosaicsOf(db: Db, micrographIds: string[]): Promise<Map<string, MosaicRow>> {
  if (!micrographIds.length) return new Map();
  const rows = await db.select().from(mosaics).where(inArray(mosaics.micrographId, micrographIds));
  return new Map(rows.map((r) => [r.micrographId, r]));
}

export type NewMosaic = Pick<
  MosaicRow,
  "micrographId" | "rows" | "cols" | "order" | "overlapPercent" | "flatField" | "frameWidth" | "frameHeight" | "frameFormat"
>;

/** Records a mosaic's grid beside its micrograph row, in the caller's transaction (the micrograph insert checked the rights). */
export async function insertMosaic(db: Db, m: NewMosaic): Promise<void> {
  await db.insert(mosaics).values({ ...m, stage: "checking", stageProgress: 0 });
}

// ---- What the stitch job reads and writes (no actor: the rights were checked when it was queued).

/** The mosaic a stitch job works on with its micrograph, or null when deleted meanwhile. */
export async function mosaicForJob(db: Db, micrographId: string): Promise<{ micrograph: MicrographRow; mosaic: MosaicRow } | null> {
  const [r] = await db.select().from(micrographs).innerJoin(mosaics, eq(mosaics.micrographId, micrographs.id)).where(eq(micrographs.id, micrographId));
  return r ? { micrograph: r.micrographs, mosaic: r.mosaics } : null;
}

/** Moves the stage shown to the user; false when the mosaic is gone. */
export async function setMosaicStage(db: Db, micrographId: string, stage: MosaicStage, stageProgress: number): Promise<boolean> {
  const rows = await db
    .update(mosaics)
    .set({ stage, stageProgress, updatedAt: new Date() })
    .where(eq(mosaics.micrographId, micrographId))
    .returning({ id: mosaics.micrographId });
  return rows.length > 0;
}

/**
 * A stitch again moves frame 0 within the composed image (another overlap changes the margins):
 * the image → die transform is shifted so frame 0's corner lands where it did, and the markup
 * drawn in the die frame stays on the same features.
 */
export function keepFrameZero(t: Transform | null, was: MosaicFrameDto | undefined, now: MosaicFrameDto | undefined): Transform | null {
  if (!t || !was || !now) return t;
  const [[a, b, tx], [c, d, ty]] = t;
  const dx = was.x - now.x;
  const dy = was.y - now.y;
  return [
    [a, b, tx + a * dx + b * dy],
    [c, d, ty + c * dx + d * dy],
  ];
}

export type StitchResult = {
  width: number;
  height: number;
  bytes: number;
  /** tiff or bigtiff, as the composed file's header says. */
  format: string;
  frames: MosaicFrameDto[];
  pairs: MosaicPairDto[];
  residualPx: { rms: number; max: number };
  warnings: string[];
  /** Set for a stitch again, which built and stored the preview itself. */
  preview?: { width: number; height: number };
};

/**
 * Records a composed mosaic whose original is stored: the micrograph's size (and, for the die's
 * reference, its die frame from the scale and the new height), the registration, and either the
 * ordinary tile job queued in the same transaction (first stitch) or, for a stitch again whose
 * pyramid the job built and stored itself, the micrograph ready again. False when deleted meanwhile.
 */
export async function recordStitch(db: Db, micrographId: string, r: StitchResult): Promise<boolean> {
  const tiled = r.preview !== undefined;
  return db.transaction(async (tx) => {
    const [m] = await tx.select().from(micrographs).where(eq(micrographs.id, micrographId));
    if (!m) return false;
    const [before] = await tx.select({ frames: mosaics.frames }).from(mosaics).where(eq(mosaics.micrographId, micrographId));
    const transform = tiled
      ? keepFrameZero(m.transform, before?.frames[0], r.frames[0])
      : m.isReference && m.scaleUmPerPx
        ? (frameFromScale(m.scaleUmPerPx, r.height) as Transform)
        : m.transform;
    await tx
      .update(micrographs)
      .set({
        width: r.width,
        height: r.height,
        bytes: r.bytes,
        format: r.format,
        transform,
        ...(r.preview ? { previewWidth: r.preview.width, previewHeight: r.preview.height, updatedAt: new Date() } : { status: "queued" as const, progress: 0 }),
      })
      .where(eq(micrographs.id, micrographId));
    await tx
      .update(mosaics)
      .set({
        frames: r.frames,
        pairs: r.pairs,
        residualRmsPx: r.residualPx.rms,
        residualMaxPx: r.residualPx.max,
        warnings: r.warnings,
        stage: tiled ? "done" : "tiling",
        stageProgress: tiled ? 100 : 0,
        restitching: false,
        updatedAt: new Date(),
      })
      .where(eq(mosaics.micrographId, micrographId));
    if (!tiled) await queueJob(tx, "tile", micrographId);
    return true;
  });
}

/** A stitch that failed: a first stitch fails its micrograph; a stitch again leaves the served result and says why. */
export async function failStitch(db: Db, micrographId: string, message: string): Promise<MicrographRow | null> {
  const found = await mosaicForJob(db, micrographId);
  if (!found) return null;
  if (found.mosaic.restitching) {
    await db
      .update(mosaics)
      .set({ restitching: false, stage: "done", warnings: [...found.mosaic.warnings, `Stitching again failed: ${message}`], updatedAt: new Date() })
      .where(eq(mosaics.micrographId, micrographId));
    return null;
  }
  await db.update(mosaics).set({ stage: "failed", updatedAt: new Date() }).where(eq(mosaics.micrographId, micrographId));
  const [row] = await db
    .update(micrographs)
    .set({ status: "failed", error: message, updatedAt: new Date() })
    .where(eq(micrographs.id, micrographId))
    .returning();
  return row ?? null;
}

/** A failed mosaic retried before its stitch finished goes back to the stitch job (its frames are kept). */
export async function mosaicNeedsStitch(db: Db, micrographId: string): Promise<boolean> {
  const [m] = await db.select({ stage: mosaics.stage }).from(mosaics).where(eq(mosaics.micrographId, micrographId));
  if (!m || m.stage === "tiling") return false;
  if (m.stage === "failed") await db.update(mosaics).set({ stage: "checking", stageProgress: 0 }).where(eq(mosaics.micrographId, micrographId));
  return true;
}
