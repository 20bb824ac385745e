import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import os from "node:os";
import { micrographForJob, setTilingState } from "@/server/access/job-records";
import type { Database } from "@/db/client";
import { buildPreview, buildPyramid, buildThumbnail } from "@/server/images/pyramid";
import { derivedKeys, micrographKeys } from "../storage/keys";
import { localCopy, objectStore, scratchFolder, type LocalFile } from "../storage";
import { forgetTilePack, writeTilePack } from "../storage/tile-pack";
import { env } from "../env";
import { TILE_ATTEMPTS } from "./boss";
import type { JobHandler } from "./worker";

/** Removes a micrograph's preview, pack and thumbnail from the store (the original stays). */
async function removeDerived(dieId: string, micrographId: string): Promise<void> {
  const keys = derivedKeys(dieId, micrographId);
  await Promise.all(keys.map((k) => objectStore().remove(k)));
  forgetTilePack(micrographKeys(dieId, micrographId).pack);
}

function progressReporter(db: Database, id: string) {
  let last = -1;
  let lastAt = 0;
  return (percent: number) => {
    const now = Date.now();
    if (percent === last || (now - lastAt < 500 && percent < 100)) return;
    last = percent;
    lastAt = now;
    setTilingState(db, id, { progress: percent }).catch(() => {});
  };
}

/**
 * Tiles one micrograph in a private scratch folder: preview first (stored at once, so the die
 * can be opened), then the IIIF pyramid, packed into one object, then the thumbnail; the pack
 * is stored last and the micrograph marked ready only after that, so a killed job leaves its
 * work only in scratch and never a served half-pyramid. queued → tiling → ready, or failed with
 * a reason the UI shows.
 */
async function tileMicrograph(db: Database, micrographId: string): Promise<void> {
  const m = await micrographForJob(db, micrographId);
  if (!m || !m.format) return; // deleted meanwhile
  const keys = micrographKeys(m.dieId, m.id, m.format);
  const cap = env().KERFLINE_MAX_PIXELS;
  const store = objectStore();
  await setTilingState(db, m.id, { status: "tiling" });
  const work = await scratchFolder("tiling");
  let original: LocalFile | null = null;
  try {
    original = await localCopy(keys.original!);
    if (!original) throw new Error("the original file is missing from storage");
    const preview = path.join(/*turbopackIgnore: true*/ work, "preview.jpg");
    const size = await buildPreview(original.path, preview, 2048, cap);
    await store.putFile(keys.preview, preview, "image/jpeg");
    await setTilingState(db, m.id, { previewWidth: size.width, previewHeight: size.height, progress: 2 });
    const report = progressReporter(db, m.id);
    const folder = path.join(/*turbopackIgnore: true*/ work, "pyramid");
    const pyramid = await buildPyramid(original.path, folder, { pixelCap: cap, onProgress: (pc) => report(Math.max(2, Math.min(98, pc))) });
    const thumbnail = path.join(/*turbopackIgnore: true*/ work, "thumb.jpg");
    await buildThumbnail(original.path, thumbnail, 256, cap);
    await store.putFile(keys.thumbnail, thumbnail, "image/jpeg");
    const pack = path.join(/*turbopackIgnore: true*/ work, "pyramid.tilepack");
    await writeTilePack(folder, pyramid, pack);
    await fs.rm(folder, { recursive: true, force: true }); // the folder's bytes are in the pack now: halve the scratch peak
    await store.putFile(keys.pack, pack, "application/octet-stream");
  } finally {
    await original?.release();
    await fs.rm(work, { recursive: true, force: true });
  }
  const still = await setTilingState(db, m.id, { status: "ready" });
  // Deleted while tiling: remove what was just stored, so no orphan objects remain.
  if (!still) await removeDerived(m.dieId, m.id);
}

/**
 * Builds preview, packed pyramid and thumbnail of a local image in `work`, storing nothing: a
 * stitch again builds them beside the pyramid being served and stores them only at the end.
 */
export async function buildDerivedFiles(originalPath: string, work: string, onProgress: (percent: number) => void) {
  const cap = env().KERFLINE_MAX_PIXELS;
  const preview = path.join(/*turbopackIgnore: true*/ work, "preview.jpg");
  const previewSize = await buildPreview(originalPath, preview, 2048, cap);
  const folder = path.join(/*turbopackIgnore: true*/ work, "pyramid");
  const pyramid = await buildPyramid(originalPath, folder, { pixelCap: cap, onProgress });
  const thumbnail = path.join(/*turbopackIgnore: true*/ work, "thumb.jpg");
  await buildThumbnail(originalPath, thumbnail, 256, cap);
  const pack = path.join(/*turbopackIgnore: true*/ work, "pyramid.tilepack");
  await writeTilePack(folder, pyramid, pack);
  await fs.rm(folder, { recursive: true, force: true });
  return { preview, previewSize, thumbnail, pack };
}

async function markFailed(db: Database, micrographId: string, message: string) {
  await setTilingState(db, micrographId, { status: "failed", error: message });
}

/**
 * Tiling whose attempts ran out: the micrograph is marked failed with the reason (the user can
 * retry) and the preview, pack and thumbnail the attempts may have stored are removed (their
 * work folders are in scratch, swept at start). The original stays for the retry.
 */
async function giveUpTiling(db: Database, micrographId: string, message: string): Promise<void> {
  const m = await setTilingState(db, micrographId, { status: "failed", error: message });
  if (!m) return;
  await removeDerived(m.dieId, m.id);
}

/** How many tiling jobs one process runs at once: KERFLINE_WORKER_CONCURRENCY, else one per core it may use. */
export function tilingWorkerCount(): number {
  return env().KERFLINE_WORKER_CONCURRENCY ?? Math.max(1, os.availableParallelism());
}

/** Refusals the image itself earns (too many pixels, unreadable) carry a status: no retry mends them. */
const refusal = (e: unknown) => e instanceof Error && "status" in e;

export const tiling: JobHandler = {
  kind: "tile",
  run: tileMicrograph,
  failure: (e) => (refusal(e) ? (e as Error).message : `Tiling failed: ${(e as Error).message}`),
  markFailed,
  final: refusal,
  exhausted: `Tiling stopped ${TILE_ATTEMPTS} times without finishing (the server was stopped or ran out of memory while working on it); retry it, or upload a smaller image.`,
  giveUp: giveUpTiling,
};
