import "server-only";
import PgBoss from "pg-boss";
import type { OpenedDatabase } from "@/db/client";
import { bossExecutor, JOB_KINDS, registerJobQueue, unregisterJobQueue, type JobKind } from "@/server/access/job-queue";
import { MAX_SEND_ATTEMPTS } from "@/lib/review/backoff";
import { env } from "../env";

/** The queue a job lands in when its attempts ran out (pg-boss `deadLetter`). */
export const gaveUpQueue = (kind: JobKind) => `${kind}-gave-up`;

/** Sweeps: failing jobs whose worker died, expiring exports, abandoned uploads. */
export const HOUSEKEEPING = "housekeeping";

/** The schema pg-boss keeps its tables in (its default). */
export const BOSS_SCHEMA = "pgboss";

/** Attempts of a tiling job, as before pg-boss: the first and two retries. */
export const TILE_ATTEMPTS = 3;
/** Attempts of a mosaic's stitch: a killed attempt starts again from the stored frames. */
export const STITCH_ATTEMPTS = 3;
/** Attempts of an export. */
const EXPORT_ATTEMPTS = 3;
/** Attempts of an image search: one retry (a search is repeatable; a second failure is the search's own). */
const FIND_ATTEMPTS = 2;

/**
 * Retry, back-off and expiry per queue (pg-boss docs, "Queues": retryLimit counts retries after
 * the first attempt; with retryBackoff the n-th retry waits retryDelay·2^(n-1) to twice that
 * seconds). expireInSeconds is only the outer bound of one attempt (pg-boss fails an attempt
 * still active after it, alive or not, and allows at most 24 h): a dead worker is noticed much
 * sooner by its missing heartbeat (see worker.ts).
 */
function queueOptions(): Record<JobKind, Omit<PgBoss.Queue, "name">> {
  return {
    tile: { retryLimit: TILE_ATTEMPTS - 1, retryDelay: 2, retryBackoff: true, expireInSeconds: 23 * 3600, deadLetter: gaveUpQueue("tile") },
    stitch: { retryLimit: STITCH_ATTEMPTS - 1, retryDelay: 2, retryBackoff: true, expireInSeconds: 23 * 3600, deadLetter: gaveUpQueue("stitch") },
    export: { retryLimit: EXPORT_ATTEMPTS - 1, retryDelay: 1, retryBackoff: true, expireInSeconds: 3600, deadLetter: gaveUpQueue("export") },
    mail: {
      retryLimit: MAX_SEND_ATTEMPTS - 1,
      retryDelay: mailRetryDelaySeconds(),
      retryBackoff: true,
      expireInSeconds: 600,
      deadLetter: gaveUpQueue("mail"),
    },
    // A search reads a reduced level and then small windows: minutes at most on the largest micrographs.
    find: { retryLimit: FIND_ATTEMPTS - 1, retryDelay: 1, retryBackoff: true, expireInSeconds: 1800, deadLetter: gaveUpQueue("find") },
  };
}

/** pg-boss counts retry delays in whole seconds: KERFLINE_MAIL_RETRY_MS rounded up, at least 1. */
export function mailRetryDelaySeconds(): number {
  return Math.max(1, Math.ceil(env().KERFLINE_MAIL_RETRY_MS / 1000));
}

const g = globalThis as unknown as { __kerflineBoss?: Promise<PgBoss> };

/**
 * Starts this process's one pg-boss: on PostgreSQL with a small pool of its own, on PGlite
 * through the adapter above over the process's one connection. `working` processes also run
 * pg-boss's maintenance (expiry of attempts past expireInSeconds, archiving); a web server with
 * KERFLINE_JOBS=off only sends. Creates (or updates) every queue. Cached on globalThis.
 */
export function startBoss(opened: OpenedDatabase, working: boolean): Promise<PgBoss> {
  g.__kerflineBoss ??= (async () => {
    const common = { supervise: working, schedule: false, migrate: true, maintenanceIntervalSeconds: 30 };
    const url = env().DATABASE_URL;
    const boss = url
      ? new PgBoss({ ...common, connectionString: url, max: 4, application_name: "kerfline-jobs" })
      : new PgBoss({ ...common, db: bossExecutor(opened.db) });
    boss.on("error", (e) => console.error("[kerfline] job queue:", e instanceof Error ? e.message : e));
    await boss.start();
    const options = queueOptions();
    for (const kind of JOB_KINDS) {
      await boss.createQueue(gaveUpQueue(kind), { name: gaveUpQueue(kind), retryLimit: 5, retryDelay: 5, retryBackoff: true });
      await boss.createQueue(kind, { name: kind, ...options[kind] });
      await boss.updateQueue(kind, { name: kind, ...options[kind] });
    }
    // One active at a time whichever process fetches it (pg-boss policy "singleton").
    await boss.createQueue(HOUSEKEEPING, { name: HOUSEKEEPING, policy: "singleton", retryLimit: 0, expireInSeconds: 300 });
    return boss;
  })();
  registerJobQueue(g.__kerflineBoss);
  return g.__kerflineBoss;
}

/** Stops pg-boss: no more fetching; running jobs get `timeoutMs` to finish, then are failed for a retry. */
export async function stopBoss(timeoutMs: number): Promise<void> {
  const boss = g.__kerflineBoss;
  if (!boss) return;
  await (await boss).stop({ graceful: true, timeout: timeoutMs, wait: true });
  g.__kerflineBoss = undefined;
  unregisterJobQueue();
}
