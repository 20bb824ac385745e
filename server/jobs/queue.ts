import "server-only";
import os from "node:os";
import { EventEmitter } from "node:events";
import { and, eq, gte, lt, sql } from "drizzle-orm";
import { jobs, type JobRow } from "@/db/schema";
import type { Database } from "@/db/client";

/** A job's heartbeat older than this means its worker died; the job is claimed again. */
const STALE_AFTER_SECONDS = 60;
const MAX_ATTEMPTS = 3;

/** Identifies this process's workers in `jobs.locked_by`. */
const WORKER_ID = `${os.hostname()}:${process.pid}`;

const g = globalThis as unknown as { __kerflineJobEvents?: EventEmitter };
const events = (g.__kerflineJobEvents ??= new EventEmitter());

/** Wakes this process's idle workers (other processes find new jobs by polling). */
export function notifyJobs(): void {
  events.emit("job");
}

/** Resolves when notified or after `ms`, whichever is first. */
export function waitForJob(ms: number): Promise<void> {
  return new Promise((resolve) => {
    const done = () => {
      clearTimeout(timer);
      events.off("job", done);
      resolve();
    };
    const timer = setTimeout(done, ms);
    events.once("job", done);
  });
}

type RawJob = { id: string; kind: string; subject_id: string; attempts: number };

/**
 * Claims the oldest queued job of a kind, or one whose worker stopped beating. `FOR UPDATE
 * SKIP LOCKED` lets several worker processes share the table without taking the same job.
 */
export async function claimJob(db: Database, kind: string): Promise<Pick<JobRow, "id" | "kind" | "subjectId" | "attempts"> | null> {
  const result = (await db.execute(sql`
    update ${jobs} set status = 'running', locked_by = ${WORKER_ID}, heartbeat_at = now(), attempts = attempts + 1, updated_at = now()
    where id = (
      select id from ${jobs}
      where kind = ${kind} and attempts < ${MAX_ATTEMPTS}
        and (status = 'queued' or (status = 'running' and heartbeat_at < now() - make_interval(secs => ${STALE_AFTER_SECONDS})))
      order by created_at
      limit 1
      for update skip locked
    )
    returning id, kind, subject_id, attempts`)) as unknown as { rows: RawJob[] };
  const row = result.rows[0];
  return row ? { id: row.id, kind: row.kind, subjectId: row.subject_id, attempts: row.attempts } : null;
}

/** Keeps a claimed job's heartbeat fresh while it runs; returns the stop function. */
export function keepAlive(db: Database, jobId: string): () => void {
  const timer = setInterval(() => {
    db.update(jobs)
      .set({ heartbeatAt: new Date() })
      .where(and(eq(jobs.id, jobId), eq(jobs.lockedBy, WORKER_ID)))
      .catch(() => {});
  }, 5_000);
  return () => clearInterval(timer);
}

export async function finishJob(db: Database, jobId: string, error?: string): Promise<void> {
  await db
    .update(jobs)
    .set({ status: error ? "failed" : "done", error: error ?? null, updatedAt: new Date() })
    .where(eq(jobs.id, jobId));
}

/**
 * On the embedded database only this process can hold the data dir, so jobs marked running
 * were left by a crash of this same installation: queue them again at once (those at the
 * attempt limit are left for `giveUpExhaustedJobs`).
 */
export async function requeueOrphanedJobs(db: Database): Promise<number> {
  const rows = await db
    .update(jobs)
    .set({ status: "queued", lockedBy: null })
    .where(and(eq(jobs.status, "running"), lt(jobs.attempts, MAX_ATTEMPTS)))
    .returning({ id: jobs.id });
  return rows.length;
}

const exhaustedMessage = (kind: string) =>
  `${kind === "tile" ? "Tiling" : "The job"} stopped ${MAX_ATTEMPTS} times without finishing (the server was stopped or ran out of memory while working on it); retry it, or upload a smaller image.`;

/**
 * Jobs that crashed on their last allowed attempt are never claimed again: marks them failed
 * with the reason and returns their subjects so the caller can fail those too. A job counts
 * as crashed when it is left running with a stale heartbeat, or (`orphaned`, the embedded
 * database at start) whenever it is still marked running.
 */
export async function giveUpExhaustedJobs(db: Database, kind: string, orphaned = false): Promise<{ id: string; subjectId: string; error: string }[]> {
  const error = exhaustedMessage(kind);
  const stale = orphaned ? sql`true` : sql`${jobs.heartbeatAt} < now() - make_interval(secs => ${STALE_AFTER_SECONDS})`;
  return db
    .update(jobs)
    .set({ status: "failed", error, lockedBy: null, updatedAt: new Date() })
    .where(and(eq(jobs.kind, kind), eq(jobs.status, "running"), gte(jobs.attempts, MAX_ATTEMPTS), stale))
    .returning({ id: jobs.id, subjectId: jobs.subjectId, error: sql<string>`${jobs.error}` });
}
