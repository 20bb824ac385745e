import "server-only";
import type { Database } from "@/db/client";
import { claimJob, finishJob, keepAlive, waitForJob } from "./queue";

/** What one kind of job needs from the shared loop. */
export type JobHandler = {
  kind: string;
  /** Does the work for one subject (a micrograph, an export). */
  run(db: Database, subjectId: string): Promise<void>;
  /** The message the UI shows when `run` throws, recorded on the subject. */
  failure(e: unknown): string;
  markFailed(db: Database, subjectId: string, message: string): Promise<void>;
  /** Housekeeping between jobs, at most every `everyMs` (expiry, giving up exhausted jobs). */
  sweep?: { everyMs: () => number; run(db: Database): Promise<unknown> };
};

/**
 * The one worker loop: sweep when due, claim a job of the handler's kind, keep its heartbeat
 * while it runs, record success or the failure reason. Waits (woken early by new jobs) when idle.
 */
async function workerLoop(db: Database, handler: JobHandler, stopped: () => boolean): Promise<void> {
  let lastSweep = 0;
  while (!stopped()) {
    if (handler.sweep && Date.now() - lastSweep > handler.sweep.everyMs()) {
      lastSweep = Date.now();
      await handler.sweep.run(db).catch((e) => console.error(`[kerfline] ${handler.kind} housekeeping failed:`, e));
    }
    const job = await claimJob(db, handler.kind).catch((e) => {
      console.error("[kerfline] could not claim a job:", e);
      return null;
    });
    if (!job) {
      await waitForJob(1_000);
      continue;
    }
    const stop = keepAlive(db, job.id);
    try {
      await handler.run(db, job.subjectId);
      await finishJob(db, job.id);
    } catch (e) {
      const message = handler.failure(e);
      console.error(`[kerfline] ${handler.kind} ${job.subjectId} failed:`, (e as Error).message);
      await handler.markFailed(db, job.subjectId, message).catch(() => {});
      await finishJob(db, job.id, message).catch(() => {});
    } finally {
      stop();
    }
  }
}

/** Starts `count` in-process workers for one kind of job; returns the stop function. */
export function startWorkers(db: Database, handler: JobHandler, count: number): () => void {
  let stopped = false;
  for (let i = 0; i < count; i++) void workerLoop(db, handler, () => stopped);
  return () => {
    stopped = true;
  };
}
