import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import os from "node:os";
import { eq } from "drizzle-orm";
import { micrographs } from "@/db/schema";
import type { Database } from "@/db/client";
import { buildPreview, buildPyramid, buildThumbnail } from "@/lib/tiles/pyramid";
import { micrographPaths, EXTENSION } from "../storage-paths";
import { env } from "../env";
import { claimJob, finishJob, giveUpExhaustedJobs, keepAlive, waitForJob } from "./queue";

/** Removes work folders a killed tiler left beside the pyramid (they are never served). */
async function removeLeftovers(tilesDir: string, micrographId: string): Promise<void> {
  const names = await fs.readdir(tilesDir).catch(() => [] as string[]);
  await Promise.all(
    names.filter((n) => n.startsWith(`${micrographId}-`) && n.includes("-partial-")).map((n) => fs.rm(path.join(tilesDir, n), { recursive: true, force: true })),
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
    db.update(micrographs).set({ progress: percent }).where(eq(micrographs.id, id)).catch(() => {});
  };
}

/**
 * Tiles one micrograph: preview first (so the die can be opened at once), then the IIIF
 * pyramid (built aside and renamed into place), then the thumbnail. The micrograph goes
 * queued → tiling → ready, or failed with a reason the UI shows.
 */
async function tileMicrograph(db: Database, micrographId: string): Promise<void> {
  const [m] = await db.select().from(micrographs).where(eq(micrographs.id, micrographId));
  if (!m || !m.format) return; // deleted meanwhile
  const p = micrographPaths(m.dieId, m.id, m.format as keyof typeof EXTENSION);
  const cap = env().KERFLINE_MAX_PIXELS;
  await removeLeftovers(p.tilesDir, m.id);
  await db.update(micrographs).set({ status: "tiling", progress: 0, error: null }).where(eq(micrographs.id, m.id));
  const preview = await buildPreview(p.original!, p.preview, 2048, cap);
  await db.update(micrographs).set({ previewWidth: preview.width, previewHeight: preview.height, progress: 2 }).where(eq(micrographs.id, m.id));
  const report = progressReporter(db, m.id);
  await buildPyramid(p.original!, p.pyramid, { pixelCap: cap, onProgress: (pc) => report(Math.max(2, Math.min(98, pc))) });
  await buildThumbnail(p.original!, p.thumbnail, 256, cap);
  const [still] = await db
    .update(micrographs)
    .set({ status: "ready", progress: 100, updatedAt: new Date() })
    .where(eq(micrographs.id, m.id))
    .returning({ id: micrographs.id });
  // Deleted while tiling: remove what was just written, so no orphan files remain.
  if (!still) await Promise.all([p.pyramid, p.preview, p.thumbnail].map((f) => fs.rm(f, { recursive: true, force: true })));
}

async function markFailed(db: Database, micrographId: string, message: string) {
  await db.update(micrographs).set({ status: "failed", error: message, updatedAt: new Date() }).where(eq(micrographs.id, micrographId));
}

/**
 * Tiling jobs that crashed on their last attempt: the micrograph is marked failed with the
 * reason (the user can retry) and every file the attempts left — work folders, a half-written
 * pyramid, preview and thumbnail — is removed. The original stays for the retry.
 */
export async function failExhaustedTiling(db: Database, orphaned = false): Promise<number> {
  const given = await giveUpExhaustedJobs(db, "tile", orphaned);
  for (const job of given) {
    const [m] = await db
      .update(micrographs)
      .set({ status: "failed", error: job.error, updatedAt: new Date() })
      .where(eq(micrographs.id, job.subjectId))
      .returning();
    if (!m) continue;
    const p = micrographPaths(m.dieId, m.id, (m.format ?? undefined) as keyof typeof EXTENSION | undefined);
    await removeLeftovers(p.tilesDir, m.id);
    await Promise.all([p.pyramid, p.preview, p.thumbnail].map((f) => fs.rm(f, { recursive: true, force: true })));
    console.error(`[kerfline] gave up tiling ${m.id}: ${job.error}`);
  }
  return given.length;
}

/** One worker loop: claim, tile, repeat; sleeps until notified or for a second when idle. */
async function workerLoop(db: Database, stopped: () => boolean): Promise<void> {
  let lastSweep = 0;
  while (!stopped()) {
    if (Date.now() - lastSweep > 30_000) {
      lastSweep = Date.now();
      await failExhaustedTiling(db).catch((e) => console.error("[kerfline] could not sweep exhausted jobs:", e));
    }
    const job = await claimJob(db, "tile").catch((e) => {
      console.error("[kerfline] could not claim a job:", e);
      return null;
    });
    if (!job) {
      await waitForJob(1_000);
      continue;
    }
    const stop = keepAlive(db, job.id);
    try {
      await tileMicrograph(db, job.subjectId);
      await finishJob(db, job.id);
    } catch (e) {
      const message = e instanceof Error && "status" in e ? e.message : `Tiling failed: ${(e as Error).message}`;
      console.error(`[kerfline] tiling ${job.subjectId} failed:`, (e as Error).message);
      await markFailed(db, job.subjectId, message).catch(() => {});
      await finishJob(db, job.id, message).catch(() => {});
    } finally {
      stop();
    }
  }
}

/** How many in-process tiling workers run: one per core this process may use. */
export function tilingWorkerCount(): number {
  return Math.max(1, os.availableParallelism());
}

/** Starts the in-process tiling workers (tilingWorkerCount of them). */
export function startTilingWorkers(db: Database): () => void {
  let stopped = false;
  const count = tilingWorkerCount();
  for (let i = 0; i < count; i++) void workerLoop(db, () => stopped);
  return () => {
    stopped = true;
  };
}
