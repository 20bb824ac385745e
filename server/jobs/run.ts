import "server-only";
import type { OpenedDatabase } from "@/db/client";
import { env } from "../env";
import { mailDelivery } from "../mail/sender";
import { startBoss } from "./boss";
import { exporting } from "./export";
import { findingSimilar } from "./find-similar";
import { tiling, tilingWorkerCount } from "./tiling";
import { stitching } from "./stitch";
import { drainGaveUp, failStaleJobs, startJobWorkers, type WorkerPlan } from "./worker";

/** Raised before anything starts when the processes are configured in a way that cannot work. */
export class ProcessLayoutError extends Error {}

/**
 * What runs where: `embedded` (KERFLINE_JOBS=on, the default) serves HTTP and runs jobs in one
 * process; `web` (KERFLINE_JOBS=off) only queues; `worker` (`npm run worker`) only runs jobs.
 */
export type ProcessRole = "embedded" | "web" | "worker";

export function webRole(): ProcessRole {
  return env().KERFLINE_JOBS === "off" ? "web" : "embedded";
}

/**
 * Refuses a layout of several processes that cannot share what they need: the embedded
 * database belongs to one process, and the local mail server to the process that runs it.
 */
export function assertProcessLayout(role: ProcessRole): void {
  if (role === "embedded") return;
  const how = role === "worker" ? "`npm run worker` runs jobs apart from the web servers" : "KERFLINE_JOBS=off leaves jobs to `npm run worker` processes";
  const missing: string[] = [];
  if (!env().DATABASE_URL) missing.push("DATABASE_URL (the embedded database can be opened by one process only)");
  if (!env().SMTP_URL) missing.push("SMTP_URL (the local mail server is a convenience of the single-process embedded mode)");
  if (missing.length) throw new ProcessLayoutError(`${how}, so every process needs ${missing.join(" and ")}.`);
}

function workerPlans(): WorkerPlan[] {
  const mailPoll = Math.max(0.5, env().KERFLINE_MAIL_POLL_MS / 1000);
  return [
    { handler: tiling, count: tilingWorkerCount(), pollSeconds: 1 },
    // One stitch at a time: composition uses every core sharp is given.
    { handler: stitching, count: 1, pollSeconds: 1 },
    // One export at a time, so a large render never takes every core from tiling.
    { handler: exporting, count: 1, pollSeconds: 1 },
    { handler: mailDelivery, count: 1, pollSeconds: mailPoll },
    // One search at a time: it is interactive, but a second at once would halve both.
    { handler: findingSimilar, count: 1, pollSeconds: 0.5 },
  ];
}

/**
 * Starts the job queue for this process's role. A web server only gets a sender. A working
 * process on the embedded database first settles jobs an earlier stop left running (only this
 * process can hold the data dir, so they have no live worker): failed through pg-boss so their
 * retries apply, and those out of attempts given up at once. Returns a stop function.
 */
export async function startJobs(opened: OpenedDatabase, role: ProcessRole): Promise<() => void> {
  const working = role !== "web";
  const boss = await startBoss(opened, working);
  if (!working) return () => {};
  const plans = workerPlans();
  if (opened.kind === "pglite") {
    const orphans = await failStaleJobs(boss, opened.db, -1);
    if (orphans.retried) console.log(`[kerfline] picked up ${orphans.retried} job(s) left running by an earlier stop`);
    const gaveUp = await drainGaveUp(
      boss,
      opened.db,
      plans.map((p) => p.handler),
    );
    if (gaveUp.tile) console.log(`[kerfline] gave up ${gaveUp.tile} tiling job(s) that stopped on their last attempt`);
  }
  return startJobWorkers(boss, opened.db, plans);
}
