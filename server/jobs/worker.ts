import "server-only";
import { env } from "../env";
import { sweepAbandonedUploads } from "../uploads/stores";
import os from "node:os";
import type PgBoss from "pg-boss";
import { sql } from "drizzle-orm";
import { jobHeartbeats } from "@/db/schema";
import type { Database } from "@/db/client";
import { beatJob, endBeats } from "@/server/access/job-records";
import { JOB_KINDS, type JobData, type JobKind } from "@/server/access/job-queue";
import { BOSS_SCHEMA, gaveUpQueue, HOUSEKEEPING } from "./boss";
import { localWorkers } from "./queue";

/** What one kind of job needs from the shared worker code. */
export type JobHandler = {
  kind: JobKind;
  /** Does the work for one subject (a micrograph, an export, a message). */
  run(db: Database, subjectId: string): Promise<void>;
  /** The message the UI shows when `run` throws, recorded on the subject after the last attempt. */
  failure(e: unknown): string;
  markFailed(db: Database, subjectId: string, message: string): Promise<void>;
  /** An error no retry can mend (a refused image): the subject fails at once, without retries. */
  final?(e: unknown): boolean;
  /** The reason shown when the attempts ran out without an error of their own (the worker died each time). */
  exhausted?: string;
  /** What giving up does; markFailed unless the kind has files to clear too. */
  giveUp?(db: Database, subjectId: string, message: string): Promise<void>;
  /** Housekeeping of the kind, run by the housekeeping job at most every `everyMs` per process. */
  sweep?: { everyMs: () => number; run(db: Database): Promise<unknown> };
};

/** Names this process in heartbeats. */
const WORKER = `${os.hostname()}:${process.pid}`;
/** A job silent this long is taken to have lost its worker (a process killed, a machine gone)… */
const staleSeconds = () => env().KERFLINE_JOB_STALE_SECONDS;
/** …a running job writes a heartbeat six times in that time… */
const beatMs = () => (staleSeconds() * 1000) / 6;
/** …and a working process asks for a housekeeping round (one runs, whoever asks) four times. */
const housekeepingEverySeconds = () => Math.max(1, Math.round(staleSeconds() / 4));

/** One attempt: heartbeat while it runs; a failure is thrown back to pg-boss, which retries it. */
async function runAttempt(db: Database, handler: JobHandler, job: PgBoss.JobWithMetadata<JobData>): Promise<void> {
  const subjectId = job.data.subjectId;
  const beat = () => beatJob(db, job.id, handler.kind, WORKER).catch(() => {});
  await beat();
  const timer = setInterval(beat, beatMs());
  try {
    await handler.run(db, subjectId);
  } catch (e) {
    const message = handler.failure(e);
    console.error(`[kerfline] ${handler.kind} ${subjectId} failed (attempt ${job.retryCount + 1} of ${job.retryLimit + 1}):`, (e as Error).message);
    if (handler.final?.(e)) {
      await handler.markFailed(db, subjectId, message);
      return;
    }
    // pg-boss keeps the thrown error as the job's output; the dead-letter copy carries it.
    throw Object.assign(new Error(message), { reason: message });
  } finally {
    clearInterval(timer);
    await endBeats(db, [job.id]).catch(() => {});
  }
}

const exhaustedMessage = (handler: JobHandler) =>
  handler.exhausted ?? `The ${handler.kind} job stopped on every attempt without finishing (its worker was stopped each time); try again.`;

/** Records on the subject that a job's attempts ran out: its own last error, or that it never finished. */
async function giveUp(db: Database, handler: JobHandler, job: PgBoss.JobWithMetadata<JobData>): Promise<void> {
  const output = job.output as { reason?: unknown } | null;
  const message = typeof output?.reason === "string" ? output.reason : exhaustedMessage(handler);
  await (handler.giveUp ?? handler.markFailed)(db, job.data.subjectId, message);
  console.error(`[kerfline] gave up ${handler.kind} ${job.data.subjectId}: ${message}`);
}

/** Handles every waiting dead letter of the kinds now (used at start-up); returns how many per kind. */
export async function drainGaveUp(boss: PgBoss, db: Database, handlers: JobHandler[]): Promise<Partial<Record<JobKind, number>>> {
  const counts: Partial<Record<JobKind, number>> = {};
  for (const handler of handlers) {
    const queue = gaveUpQueue(handler.kind);
    for (;;) {
      const jobs = await boss.fetch<JobData>(queue, { includeMetadata: true, batchSize: 50 });
      if (jobs.length === 0) break;
      for (const job of jobs) await giveUp(db, handler, job);
      await boss.complete(
        queue,
        jobs.map((j) => j.id),
      );
      counts[handler.kind] = (counts[handler.kind] ?? 0) + jobs.length;
    }
  }
  return counts;
}

/**
 * Fails, through pg-boss (so its retry and back-off apply), every active job whose heartbeat
 * (or start) is older than `staleSeconds`: its worker died. pg-boss 10 has no heartbeat of its
 * own, so this reads its job table (columns as in pg-boss's schema: name, id, state,
 * started_on, retry_count, retry_limit). Returns how many will be retried and how many ran out.
 */
export async function failStaleJobs(boss: PgBoss, db: Database, staleSeconds: number): Promise<{ retried: number; exhausted: number }> {
  const kinds = sql.join(
    JOB_KINDS.map((k) => sql`${k}`),
    sql`, `,
  );
  const result = (await db.execute(sql`
    select j.name, j.id, j.retry_count < j.retry_limit as "willRetry"
    from ${sql.raw(BOSS_SCHEMA)}.job j left join ${jobHeartbeats} h on h.job_id = j.id
    where j.name in (${kinds}) and j.state = 'active'
      and greatest(j.started_on, h.beat_at) < now() - make_interval(secs => ${staleSeconds})`)) as unknown as {
    rows: { name: JobKind; id: string; willRetry: boolean }[];
  };
  const rows = result.rows;
  for (const kind of JOB_KINDS) {
    const ids = rows.filter((r) => r.name === kind).map((r) => r.id);
    for (const id of ids) await boss.fail(kind, id, { message: "The worker holding this job stopped." });
  }
  await endBeats(
    db,
    rows.map((r) => r.id),
  );
  const retried = rows.filter((r) => r.willRetry).length;
  return { retried, exhausted: rows.length - retried };
}

/** One housekeeping round: dead workers' jobs, then each kind's sweep when due, then abandoned uploads. */
async function housekeeping(boss: PgBoss, db: Database, handlers: JobHandler[], lastSwept: Map<JobKind, number>): Promise<void> {
  const stale = await failStaleJobs(boss, db, staleSeconds());
  if (stale.retried + stale.exhausted > 0) {
    console.error(`[kerfline] failed ${stale.retried + stale.exhausted} job(s) whose worker stopped (${stale.retried} to be retried)`);
  }
  for (const h of handlers) {
    if (!h.sweep || Date.now() - (lastSwept.get(h.kind) ?? 0) < h.sweep.everyMs()) continue;
    lastSwept.set(h.kind, Date.now());
    await h.sweep.run(db).catch((e) => console.error(`[kerfline] ${h.kind} housekeeping failed:`, e));
  }
  const removed = await sweepAbandonedUploads().catch((e) => {
    console.error("[kerfline] upload sweep failed:", e);
    return 0;
  });
  if (removed) console.log(`[kerfline] removed ${removed} abandoned resumable upload(s)`);
}

export type WorkerPlan = { handler: JobHandler; count: number; pollSeconds: number };

/**
 * Starts this process's workers: `count` per kind, one per dead-letter queue, and the
 * housekeeping worker, which this process asks for four times per KERFLINE_JOB_STALE_SECONDS
 * (pg-boss throttling keeps it to one round per slot however many processes ask). Returns the
 * function that stops asking.
 */
export async function startJobWorkers(boss: PgBoss, db: Database, plans: WorkerPlan[]): Promise<() => void> {
  const handlers = plans.map((p) => p.handler);
  for (const { handler, count, pollSeconds } of plans) {
    for (let i = 0; i < count; i++) {
      // pg-boss waits a polling interval after every fetch, even one that found a job: asking it
      // again at once when a job ends drains a backlog (a burst of mail) at full speed.
      let id = "";
      id = await boss.work<JobData>(handler.kind, { includeMetadata: true, pollingIntervalSeconds: pollSeconds }, ([job]) =>
        runAttempt(db, handler, job).finally(() => boss.notifyWorker(id)),
      );
      localWorkers().set(id, handler.kind);
    }
    await boss.work<JobData>(gaveUpQueue(handler.kind), { includeMetadata: true, pollingIntervalSeconds: 2 }, ([job]) => giveUp(db, handler, job));
  }
  const lastSwept = new Map<JobKind, number>();
  await boss.work(HOUSEKEEPING, { pollingIntervalSeconds: 5 }, () => housekeeping(boss, db, handlers, lastSwept));
  const ask = () =>
    boss.sendThrottled(HOUSEKEEPING, {}, {}, housekeepingEverySeconds(), HOUSEKEEPING).catch((e) => console.error("[kerfline] housekeeping:", e));
  void ask();
  const timer = setInterval(ask, housekeepingEverySeconds() * 1000);
  return () => clearInterval(timer);
}
