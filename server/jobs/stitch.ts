import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import type { Database } from "@/db/client";
import type { MosaicRow } from "@/db/schema";
import type { MosaicStage } from "@/lib/dto/micrographs";
import { failStitch, mosaicForJob, recordStitch, setMosaicStage, type StitchResult } from "@/server/access/mosaics";
import { stitchMosaic } from "@/server/images/mosaic/stitch";
import { probeImage } from "@/server/images/limits";
import { micrographKeys, mosaicFrameKey } from "../storage/keys";
import { localCopy, objectStore, scratchFolder, type LocalFile } from "../storage";
import { forgetTilePack } from "../storage/tile-pack";
import { env } from "../env";
import { STITCH_ATTEMPTS } from "./boss";
import { buildDerivedFiles } from "./tiling";
import { notifyJobs } from "./queue";
import type { JobHandler } from "./worker";

/** Writes the stage at most twice a second (and always on a change of stage): the UI polls it. */
function stageReporter(db: Database, id: string) {
  let last = "";
  let lastAt = 0;
  return (stage: MosaicStage, percent: number) => {
    const pc = Math.max(0, Math.min(100, Math.round(percent)));
    const now = Date.now();
    if (`${stage}:${pc}` === last || (last.startsWith(`${stage}:`) && now - lastAt < 500 && pc < 100)) return;
    last = `${stage}:${pc}`;
    lastAt = now;
    setMosaicStage(db, id, stage, pc).catch(() => {});
  };
}

/** Copies (S3) or points at (local) every stored frame; the caller releases them. */
async function framesInScratch(dieId: string, mosaic: MosaicRow, report: (stage: MosaicStage, pc: number) => void): Promise<LocalFile[]> {
  const n = mosaic.rows * mosaic.cols;
  const files: LocalFile[] = [];
  try {
    for (let i = 0; i < n; i++) {
      const f = await localCopy(mosaicFrameKey(dieId, mosaic.micrographId, i, mosaic.frameFormat));
      if (!f) throw new Error(`frame ${i + 1} is missing from storage`);
      files.push(f);
      report("checking", ((i + 1) / n) * 100);
    }
    return files;
  } catch (e) {
    await Promise.all(files.map((f) => f.release()));
    throw e;
  }
}

/**
 * Stitches a mosaic in a private scratch folder: frames from the store, registration,
 * placement and composition (server/images/mosaic), then the composed TIFF stored as the
 * micrograph's original and, in the same transaction that records the registration, the
 * ordinary tile job queued. A stitch again (the micrograph already served) builds the pyramid
 * here too and stores original, preview, thumbnail and pack only at the end, so the previous
 * result is served until the new one is whole. A killed attempt leaves its work only in scratch
 * and the retry starts again from the stored frames.
 */
async function stitch(db: Database, micrographId: string): Promise<void> {
  const found = await mosaicForJob(db, micrographId);
  if (!found) return; // deleted meanwhile
  const { micrograph: m, mosaic } = found;
  const again = mosaic.restitching;
  const report = stageReporter(db, m.id);
  await setMosaicStage(db, m.id, "checking", 0);
  const work = await scratchFolder("stitch");
  let frames: LocalFile[] = [];
  try {
    frames = await framesInScratch(m.dieId, mosaic, report);
    const outPath = path.join(/*turbopackIgnore: true*/ work, "mosaic.tif");
    const layout = await stitchMosaic({
      framePaths: frames.map((f) => f.path),
      rows: mosaic.rows,
      cols: mosaic.cols,
      order: mosaic.order,
      overlapPercent: mosaic.overlapPercent,
      flatField: mosaic.flatField,
      outPath,
      workDir: work,
      onProgress: (stage, pc) => report(stage, pc),
    });
    await Promise.all(frames.map((f) => f.release()));
    frames = [];
    // The composed image goes through the same header check as an upload (and the pixel cap).
    const probe = await probeImage(outPath, env().KERFLINE_MAX_PIXELS);
    const result: StitchResult = {
      width: probe.width,
      height: probe.height,
      bytes: (await fs.stat(outPath)).size,
      format: probe.format,
      frames: layout.frames,
      pairs: layout.pairs,
      residualPx: layout.residualPx,
      warnings: layout.warnings,
    };
    const keys = micrographKeys(m.dieId, m.id, probe.format);
    const store = objectStore();
    if (again) {
      await setMosaicStage(db, m.id, "tiling", 0);
      const built = await buildDerivedFiles(outPath, work, (pc) => report("tiling", pc));
      // Swap: original and small images first, the pack last (the tile route reads the pack).
      await store.putFile(keys.original!, outPath, "image/tiff");
      await store.putFile(keys.preview, built.preview, "image/jpeg");
      await store.putFile(keys.thumbnail, built.thumbnail, "image/jpeg");
      await store.putFile(keys.pack, built.pack, "application/octet-stream");
      forgetTilePack(keys.pack);
      result.preview = built.previewSize;
    } else {
      await store.putFile(keys.original!, outPath, "image/tiff");
    }
    if (!(await recordStitch(db, m.id, result))) await store.remove(keys.original!); // deleted meanwhile
  } finally {
    await Promise.all(frames.map((f) => f.release()));
    await fs.rm(work, { recursive: true, force: true });
  }
  notifyJobs();
}

/** Refusals the frames themselves earn (the composed image over the pixel cap) carry a status: no retry mends them. */
const refusal = (e: unknown) => e instanceof Error && "status" in e;

export const stitching: JobHandler = {
  kind: "stitch",
  run: stitch,
  failure: (e) => (refusal(e) ? (e as Error).message : `Stitching failed: ${(e as Error).message}`),
  markFailed: async (db, id, message) => void (await failStitch(db, id, message)),
  final: refusal,
  exhausted: `Stitching stopped ${STITCH_ATTEMPTS} times without finishing (the server was stopped or ran out of memory while working on it); retry it.`,
};
