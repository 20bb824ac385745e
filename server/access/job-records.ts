import "server-only";
import { and, eq, inArray, lt, sql } from "drizzle-orm";
import {
  exports as exportsTable,
  imageSearches,
  jobHeartbeats,
  markup,
  micrographs,
  type ExportRow,
  type ImageSearchRow,
  type MicrographRow,
} from "@/db/schema";
import { boundingBox, type BoundingBox } from "@/lib/geometry/measure";
import type { Db } from "./context";

// The rows background jobs read and move through their states. Jobs run on behalf of a request
// whose rights were checked when the job was queued, so nothing here takes an actor.

/** The micrograph a tiling job works on, or null when it was deleted meanwhile. */
export async function micrographForJob(db: Db, micrographId: string): Promise<MicrographRow | null> {
  const [m] = await db.select().from(micrographs).where(eq(micrographs.id, micrographId));
  return m ?? null;
}

type TilingChange =
  | { status: "tiling" }
  | { progress: number }
  | { previewWidth: number; previewHeight: number; progress: number }
  | { status: "ready" }
  | { status: "failed"; error: string };

/**
 * Moves a micrograph's tiling state; answers the row after the change, or null when the
 * micrograph no longer exists (deleted while tiling).
 */
export async function setTilingState(db: Db, micrographId: string, change: TilingChange): Promise<MicrographRow | null> {
  const values = !("status" in change)
    ? change
    : change.status === "tiling"
      ? { status: "tiling" as const, progress: 0, error: null }
      : change.status === "ready"
        ? { status: "ready" as const, progress: 100, updatedAt: new Date() }
        : { status: "failed" as const, error: change.error, updatedAt: new Date() };
  const [row] = await db.update(micrographs).set(values).where(eq(micrographs.id, micrographId)).returning();
  return row ?? null;
}

/** The export a render job works on, or null when it expired or was deleted. */
export async function exportForJob(db: Db, exportId: string): Promise<ExportRow | null> {
  const [row] = await db.select().from(exportsTable).where(eq(exportsTable.id, exportId));
  return row ?? null;
}

/** Moves an export's state (running with progress, done with its file, failed with a reason). */
export async function setExportState(
  db: Db,
  exportId: string,
  changes: Partial<Pick<ExportRow, "status" | "progress" | "error" | "fileName" | "bytes" | "params" | "finishedAt">>,
): Promise<void> {
  await db.update(exportsTable).set(changes).where(eq(exportsTable.id, exportId));
}

/** The image search a find job works on, or null when its micrograph (and so the search) was deleted. */
export async function searchForJob(db: Db, searchId: string): Promise<ImageSearchRow | null> {
  const [row] = await db.select().from(imageSearches).where(eq(imageSearches.id, searchId));
  return row ?? null;
}

/** Moves a search's state (running with progress, done with its result, failed with a reason). */
export async function setSearchState(
  db: Db,
  searchId: string,
  changes: Partial<Pick<ImageSearchRow, "status" | "progress" | "error" | "result" | "finishedAt">>,
): Promise<void> {
  await db.update(imageSearches).set(changes).where(eq(imageSearches.id, searchId));
}

/** Bounding boxes (die µm) of the die's shapes of one kind, as they are now: candidates on them are already marked. */
export async function markedBoxes(db: Db, dieId: string, kind: "pad" | "block"): Promise<BoundingBox[]> {
  const rows = await db
    .select({ geometry: markup.geometry })
    .from(markup)
    .where(and(eq(markup.dieId, dieId), eq(markup.kind, kind)));
  return rows.map((r) => boundingBox(r.geometry));
}

/** Deletes searches finished before `olderThan` (their answers were read long ago); returns how many. */
export async function expireSearches(db: Db, olderThan: Date): Promise<number> {
  const gone = await db
    .delete(imageSearches)
    .where(and(inArray(imageSearches.status, ["done", "failed"]), lt(imageSearches.finishedAt, olderThan)))
    .returning({ id: imageSearches.id });
  return gone.length;
}

/** Records that `worker` (host:pid) still holds job `jobId` (written every few seconds while it runs). */
export async function beatJob(db: Db, jobId: string, queue: string, worker: string): Promise<void> {
  await db
    .insert(jobHeartbeats)
    .values({ jobId, queue, worker })
    .onConflictDoUpdate({ target: jobHeartbeats.jobId, set: { beatAt: sql`now()`, worker } });
}

/** Forgets the heartbeats of jobs that ended (or were failed for a dead worker). */
export async function endBeats(db: Db, jobIds: string[]): Promise<void> {
  if (jobIds.length) await db.delete(jobHeartbeats).where(inArray(jobHeartbeats.jobId, jobIds));
}
