import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { sql } from "drizzle-orm";
import { openDatabase, type OpenedDatabase } from "@/db/client";
import { bossExecutor, queueJob } from "@/server/access/job-queue";
import { startBoss, stopBoss } from "@/server/jobs/boss";
import { failStaleJobs, startJobWorkers, type JobHandler } from "@/server/jobs/worker";
import { tempDataDir } from "../support/server";
import { freshPostgresDatabase } from "../support/postgres";

// The job queue (pg-boss) on the engine of this run: the embedded PGlite through pg-boss's `db`
// adapter, or PostgreSQL with pg-boss's own pool. The handler is a stand-in whose behaviour each
// test scripts by subject; pg-boss, the queues' settings, the heartbeats and the database are real.
const engine = inject("databaseKind");
let opened: OpenedDatabase;
let stopAsking: () => void = () => {};

/** Per subject: how many attempts fail before one succeeds, and when each attempt started. */
const script = new Map<string, { failures: number; attempts: number[] }>();
const failed = new Map<string, string>();

const standIn: JobHandler = {
  kind: "export",
  async run(_db, subjectId) {
    const s = script.get(subjectId)!;
    s.attempts.push(Date.now());
    if (s.attempts.length <= s.failures) throw new Error(`the render host ran out of memory (attempt ${s.attempts.length})`);
  },
  failure: (e) => `The export failed: ${(e as Error).message}`,
  async markFailed(_db, subjectId, message) {
    failed.set(subjectId, message);
  },
};

async function until<T>(what: string, probe: () => T | undefined | false, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

function scripted(failures: number): string {
  const id = randomUUID();
  script.set(id, { failures, attempts: [] });
  return id;
}

beforeAll(async () => {
  const url = engine === "postgres" ? await freshPostgresDatabase("jobs_queue") : undefined;
  // startBoss reads DATABASE_URL from the configuration, as a server would.
  if (url) process.env.DATABASE_URL = url;
  opened = await openDatabase({ databaseUrl: url, pgliteDir: `${tempDataDir()}/pgdata` });
  const boss = await startBoss(opened, true);
  stopAsking = await startJobWorkers(boss, opened.db, [{ handler: standIn, count: 1, pollSeconds: 0.5 }]);
});

afterAll(async () => {
  stopAsking();
  await stopBoss(2_000);
  await opened?.close();
});

describe(`the job queue on ${engine}`, () => {
  it("retries a job that fails twice, waiting longer before the second retry, then finishes it", async () => {
    const id = scripted(2);
    await queueJob(opened.db, "export", id);
    const s = script.get(id)!;
    await until("the third attempt", () => s.attempts.length === 3, 40_000);
    const [first, second] = [s.attempts[1] - s.attempts[0], s.attempts[2] - s.attempts[1]];
    // pg-boss docs (retryBackoff): the n-th retry waits at least retryDelay·2^(n-1) s; the
    // export queue's retryDelay is 1 s, so at least 1 s, then at least 2 s.
    expect(first).toBeGreaterThanOrEqual(1_000);
    expect(second).toBeGreaterThanOrEqual(2_000);
    await new Promise((r) => setTimeout(r, 500));
    expect(failed.has(id)).toBe(false);
  }, 60_000);

  it("records the last attempt's reason on the subject once the attempts ran out, not before", async () => {
    const id = scripted(99);
    await queueJob(opened.db, "export", id);
    const s = script.get(id)!;
    await until("two attempts", () => s.attempts.length === 2, 20_000);
    expect(failed.has(id)).toBe(false);
    const message = await until("the reason", () => failed.get(id), 40_000);
    // Three attempts (retryLimit 2 after the first, pg-boss docs "retryLimit").
    expect(s.attempts).toHaveLength(3);
    expect(message).toBe("The export failed: the render host ran out of memory (attempt 3)");
  }, 60_000);

  it("fails a job held by a worker that stopped beating, and another attempt finishes it", async () => {
    const id = scripted(0);
    const boss = await startBoss(opened, true);
    // Held by a worker that then died: fetched by hand (pg-boss fetch), so no heartbeat is ever
    // written. Sent to start in an hour so this process's own worker cannot take it first.
    await boss.send("export", { subjectId: id }, { startAfter: 3600 });
    const [held] = await boss.fetch("export", { ignoreStartAfter: true });
    expect(held.id).toBeTruthy();
    await new Promise((r) => setTimeout(r, 1_200));
    // A live job's heartbeat is fresh: a one-minute threshold leaves it alone.
    expect(await failStaleJobs(boss, opened.db, 60)).toEqual({ retried: 0, exhausted: 0 });
    expect(await failStaleJobs(boss, opened.db, 1)).toEqual({ retried: 1, exhausted: 0 });
    const s = script.get(id)!;
    await until("the retried attempt", () => s.attempts.length === 1, 20_000);
    // The same pg-boss job, on its second attempt (retryCount counts the retries).
    expect((await boss.getJobById("export", held.id))?.retryCount).toBe(1);
  }, 40_000);

  it("queues a job in the caller's transaction: a rolled-back change leaves no job", async () => {
    const id = scripted(0);
    await opened.db
      .transaction(async (tx) => {
        await queueJob(tx, "export", id);
        throw new Error("roll back");
      })
      .catch(() => {});
    await new Promise((r) => setTimeout(r, 2_000));
    expect(script.get(id)!.attempts).toEqual([]);
    const rows = (await opened.db.execute(sql`select count(*)::int as n from pgboss.job where data->>'subjectId' = ${id}`)) as unknown as {
      rows: { n: number }[];
    };
    expect(rows.rows[0].n).toBe(0);
  });
});

describe.skipIf(engine === "postgres")("pg-boss on PGlite's single connection", () => {
  it("waits for an open transaction when sent through the main connection (so a send inside one uses the transaction)", async () => {
    const boss = await startBoss(opened, true);
    const id = scripted(0);
    let sentOutside = false;
    await opened.db.transaction(async () => {
      const outside = boss.send("export", { subjectId: id }, { db: bossExecutor(opened.db) }).then(() => (sentOutside = true));
      await new Promise((r) => setTimeout(r, 1_000));
      // PGlite runs one query at a time: the transaction holds it, the send waits its turn.
      expect(sentOutside).toBe(false);
      void outside;
    });
    await until("the send after the commit", () => sentOutside, 10_000);
  });
});
