import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { startServer, tempDataDir, type RunningServer } from "../support/server";
import { DEMO_EMAILS, demoClients } from "../support/client";
import { uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { freshPostgresDatabase } from "../support/postgres";
import { spawnWorker, startSmtpSink, type Worker } from "../support/processes";
import { square } from "./review-support";

// Web servers with KERFLINE_JOBS=off and separate `npm run worker` processes on one PostgreSQL
// database and one data dir, as the scale-out layout runs them. Real processes, real signals.
const engine = inject("databaseKind");

async function ready(w: Worker): Promise<Worker> {
  const deadline = Date.now() + 60_000;
  while (!/worker ready/.test(w.logs())) {
    if (w.proc.exitCode !== null) throw new Error(`worker exited:\n${w.logs()}`);
    if (Date.now() > deadline) throw new Error(`worker not ready:\n${w.logs()}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return w;
}

describe("a layout of several processes", () => {
  it("refuses a web server with KERFLINE_JOBS=off and no SMTP_URL, saying what is missing", async () => {
    const err = (await startServer({ env: { KERFLINE_JOBS: "off", KERFLINE_SEED: "none", SMTP_URL: "" } }).then(
      () => null,
      (e: Error & { exitCode?: number; logs?: string }) => e,
    ))!;
    expect(err).not.toBeNull();
    expect(err.exitCode).toBe(1);
    expect(err.logs).toMatch(/refusing to start: KERFLINE_JOBS=off leaves jobs to `npm run worker` processes, so every process needs .*SMTP_URL/);
  });

  it("refuses a worker without SMTP_URL", async () => {
    const w = spawnWorker({ KERFLINE_DATA_DIR: tempDataDir(), SMTP_URL: "", DATABASE_URL: "postgres://nobody@127.0.0.1:1/none" });
    expect(await w.exited).toBe(1);
    expect(w.logs()).toMatch(/refusing to start the worker: .*SMTP_URL \(the local mail server is a convenience of the single-process embedded mode\)/);
  });
});

// The kill -9 of a worker mid-tiling is in scale-out.test.ts (with S3 and two web servers).
describe.skipIf(engine !== "postgres")("web servers with KERFLINE_JOBS=off and two workers on one PostgreSQL", () => {
  let smtp: Awaited<ReturnType<typeof startSmtpSink>>;
  let web: RunningServer;
  let databaseUrl: string;
  let dataDir: string;
  let shared: Record<string, string>;
  const workers: Worker[] = [];
  let clients: Awaited<ReturnType<typeof demoClients>>;
  let teamId: string;

  beforeAll(async () => {
    smtp = await startSmtpSink();
    databaseUrl = await freshPostgresDatabase("jobs_processes");
    dataDir = tempDataDir();
    shared = { DATABASE_URL: databaseUrl, KERFLINE_DATA_DIR: dataDir, SMTP_URL: smtp.url, KERFLINE_JOB_STALE_SECONDS: "10" };
    web = await startServer({ dataDir, env: { ...shared, KERFLINE_JOBS: "off", KERFLINE_SEED: "demo-records" } });
    clients = await demoClients(web.url);
    teamId = (await clients.analyst.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
  });

  afterAll(async () => {
    for (const w of workers) if (w.proc.exitCode === null) w.proc.kill("SIGTERM");
    await Promise.all(workers.map((w) => w.exited));
    await web?.stop();
    await smtp?.stop();
  });

  async function freshDie(title: string): Promise<string> {
    const c = await clients.analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title });
    const d = await clients.analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: `${title} die`, widthUm: 1000, heightUm: 800 });
    return d.body.id;
  }

  it("queues tiling jobs on the web server without running them; workers run them, and a failing one shows its last reason", async () => {
    const dieId = await freshDie("Queued only");
    const png = await sharp({ create: { width: 900, height: 700, channels: 3, background: { r: 90, g: 110, b: 95 } } })
      .png()
      .toBuffer();
    const upload = () =>
      clients.analyst.upload<{ id: string; status: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(png, "small.png", { scaleUmPerPx: "1" }));
    const [good, lost] = [await upload(), await upload()];
    expect([good.status, lost.status]).toEqual([202, 202]);
    // The second one's original goes missing while it waits (a storage mishap): every attempt fails.
    fs.rmSync(path.join(dataDir, "originals", dieId, `${lost.body.id}.png`));
    await new Promise((r) => setTimeout(r, 4_000));
    for (const id of [good.body.id, lost.body.id]) expect((await clients.analyst.get<{ status: string }>(`/api/micrographs/${id}`)).body.status).toBe("queued");
    for (let i = 0; i < 2; i++) workers.push(spawnWorker({ ...shared, KERFLINE_WORKER_CONCURRENCY: "1" }));
    await Promise.all(workers.map(ready));
    expect((await waitForStatus(clients.analyst, good.body.id, "ready", 90_000)).progress).toBe(100);
    const failed = await waitForStatus(clients.analyst, lost.body.id, "failed", 90_000);
    expect(failed.error).toMatch(/^Tiling failed: /);
    // Failed only after the third attempt (the tile queue's retryLimit 2, pg-boss docs), on either worker.
    const logs = workers.map((w) => w.logs()).join("\n");
    for (const n of [1, 2, 3]) expect(logs).toContain(`tile ${lost.body.id} failed (attempt ${n} of 3)`);
  }, 180_000);

  it("mails one mention exactly once with two workers", async () => {
    const dieId = await freshDie("One mail");
    const t = await clients.reviewer.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, {
      region: square(100, 100),
      body: "@Demo Analyst the bond wire on VB3 is lifted",
    });
    expect(t.status).toBe(201);
    const deadline = Date.now() + 30_000;
    while (!smtp.received.some((m) => m.to.includes(DEMO_EMAILS.analyst))) {
      if (Date.now() > deadline) throw new Error("the mention mail never arrived");
      await new Promise((r) => setTimeout(r, 200));
    }
    // Several polling rounds of both workers later, still one copy.
    await new Promise((r) => setTimeout(r, 4_000));
    expect(smtp.received.filter((m) => m.to.includes(DEMO_EMAILS.analyst))).toHaveLength(1);
  }, 60_000);
});
