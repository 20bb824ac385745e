import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import os from "node:os";
import { micrographForJob, setTilingState } from "@/server/access/job-records";
import type { Database } from "@/db/client";
import { buildPreview, buildPyramid, buildThumbnail } from "@/server/images/pyramid";
import { micrographPaths, EXTENSION } from "../files/storage-paths";
import { env } from "../env";
import { TILE_ATTEMPTS } from "./boss";
import type { JobHandler } from "./worker";

/** Removes work folders a killed tiler left beside the pyramid (they are never served). */
async function removeLeftovers(tilesDir: string, micrographId: string): Promise<void> {
  const names = await fs.readdir(tilesDir).catch(() => [] as string[]);
  await Promise.all(
    names
      .filter((n) => n.startsWith(`${micrographId}-`) && n.includes("-partial-"))
      .map((n) => fs.rm(path.join(tilesDir, n), { recursive: true, force: true })),
  );
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
 * Tiles one micrograph: preview first (so the die can be opened at once), then the IIIF
 * pyramid (built aside and renamed into place), then the thumbnail. The micrograph goes
 * queued → tiling → ready, or failed with a reason the UI shows.
 */
async function tileMicrograph(db: Database, micrographId: string): Promise<void> {
  const m = await micrographForJob(db, micrographId);
  if (!m || !m.format) return; // deleted meanwhile
  const p = micrographPaths(m.dieId, m.id, m.format as keyof typeof EXTENSION);
  const cap = env().KERFLINE_MAX_PIXELS;
  await removeLeftovers(p.tilesDir, m.id);
  await setTilingState(db, m.id, { status: "tiling" });
  const preview = await buildPreview(p.original!, p.preview, 2048, cap);
  await setTilingState(db, m.id, { previewWidth: preview.width, previewHeight: preview.height, progress: 2 });
  const report = progressReporter(db, m.id);
  await buildPyramid(p.original!, p.pyramid, { pixelCap: cap, onProgress: (pc) => report(Math.max(2, Math.min(98, pc))) });
  await buildThumbnail(p.original!, p.thumbnail, 256, cap);
  const still = await setTilingState(db, m.id, { status: "ready" });
  // Deleted while tiling: remove what was just written, so no orphan files remain.
  if (!still) await Promise.all([p.pyramid, p.preview, p.thumbnail].map((f) => fs.rm(f, { recursive: true, force: true })));
}

async function markFailed(db: Database, micrographId: string, message: string) {
  await setTilingState(db, micrographId, { status: "failed", error: message });
}

/**
 * Tiling whose attempts ran out: the micrograph is marked failed with the reason (the user can
 * retry) and every file the attempts left — work folders, a half-written pyramid, preview and
 * thumbnail — is removed. The original stays for the retry.
 */
async function giveUpTiling(db: Database, micrographId: string, message: string): Promise<void> {
  const m = await setTilingState(db, micrographId, { status: "failed", error: message });
  if (!m) return;
  const p = micrographPaths(m.dieId, m.id, (m.format ?? undefined) as keyof typeof EXTENSION | undefined);
  await removeLeftovers(p.tilesDir, m.id);
  await Promise.all([p.pyramid, p.preview, p.thumbnail].map((f) => fs.rm(f, { recursive: true, force: true })));
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
