import "server-only";
import type PgBoss from "pg-boss";
import type { Db } from "./context";

// Queuing a job writes a pg-boss job row, in the caller's transaction like any other row, so it
// lives here with the data access; server/jobs starts pg-boss and runs the jobs.

/** The kinds of job a worker runs, each a pg-boss queue of that name. */
export const JOB_KINDS = ["tile", "export", "mail", "stitch", "find"] as const;
export type JobKind = (typeof JOB_KINDS)[number];

/** What every job carries: the row it works on (a micrograph, an export, an outbox message, a mosaic, an image search). */
export type JobData = { subjectId: string };

/** What pg-boss needs of a connection: PGlite and its transactions, a node-postgres pool or pool client. */
type Queryable = {
  query(text: string, values?: unknown[]): Promise<{ rows: unknown[] }>;
  exec?(text: string): Promise<{ rows: unknown[] }[]>;
};

/**
 * The driver connection under a Drizzle database or transaction (Drizzle keeps it as
 * `session.client`). pg-boss's SQL goes to it as written: it repeats numbered parameters ($5
 * three times in its insert), which a Drizzle `sql` rewrite would split into parameters of
 * different inferred types (seen on PGlite: a text parameter typed as a timestamp).
 */
function driverOf(db: Db): Queryable {
  return (db as unknown as { session: { client: Queryable } }).session.client;
}

/**
 * pg-boss's database adapter (its `db` option, pg-boss docs "Constructor": an object with
 * `executeSql(text, values)`) over a Drizzle database or transaction. Given a transaction, a
 * `send` joins it, so a job exists exactly when the row it works on does. Statements without
 * values (pg-boss's schema creation and locked maintenance are several statements in one
 * string) go to PGlite's `exec` or node-postgres's simple-query path.
 */
export function bossExecutor(db: Db): PgBoss.Db {
  return {
    async executeSql(text: string, values?: unknown[]) {
      const client = driverOf(db);
      if (values?.length) return client.query(text, values);
      if (client.exec) return (await client.exec(text)).at(-1) ?? { rows: [] };
      return client.query(text);
    },
  };
}

const g = globalThis as unknown as { __kerflineJobQueue?: Promise<PgBoss> };

/** Called once by server/jobs when this process's pg-boss is starting. */
export function registerJobQueue(boss: Promise<PgBoss>): void {
  g.__kerflineJobQueue = boss;
}

/** Forgets the stopped pg-boss. */
export function unregisterJobQueue(): void {
  g.__kerflineJobQueue = undefined;
}

/** The started pg-boss; throws when this process never started it (a script that forgot). */
export async function startedBoss(): Promise<PgBoss> {
  if (!g.__kerflineJobQueue) throw new Error("The job queue is not started in this process (startBoss first).");
  return g.__kerflineJobQueue;
}

/**
 * Queues one job in the caller's transaction (pg-boss `send` with its `db` option), so the job
 * exists exactly when the row it works on does, whichever process runs it.
 */
export async function queueJob(db: Db, kind: JobKind, subjectId: string): Promise<void> {
  const boss = await startedBoss();
  const data: JobData = { subjectId };
  await boss.send(kind, data, { db: bossExecutor(db) });
}
