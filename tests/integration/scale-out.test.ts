import { afterAll, beforeAll, beforeEach, describe, expect, it, onTestFailed } from "vitest";
import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { startServer, tempDataDir, type RunningServer } from "../support/server";
import { ApiClient, DEMO_EMAILS } from "../support/client";
import { startFakeS3, type FakeS3 } from "../support/s3-fake";
import { freshPostgresDatabase } from "../support/postgres";
import { tusClient } from "../support/tus-client";
import { spawnWorker, startSmtpSink, type Worker } from "../support/processes";
import { addPad, square } from "./review-support";

// The README's "Scaling out" set-up, run for real: one PostgreSQL 15 server, one S3-compatible
// store (s3rver), two web servers with KERFLINE_JOBS=off and two `npm run worker` processes,
// mail to an SMTP server over a socket. Runs in the PostgreSQL tier (KERFLINE_TEST_DATABASE_URL).
const databaseUrl = process.env.KERFLINE_TEST_DATABASE_URL;

/** CPU time (user + system, clock ticks) a process has used so far, from /proc. */
function cpuTicks(pid: number): number {
  const fields = fs.readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
  return Number(fields[11]) + Number(fields[12]);
}

async function until<T>(what: string, probe: () => Promise<T | undefined | false>, timeoutMs = 60_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Every file below `dir`, relative to it. */
function filesBelow(dir: string): string[] {
  return (fs.readdirSync(dir, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)));
}

describe.skipIf(!databaseUrl)("scale-out: PostgreSQL + S3 + two web servers + two workers", () => {
  let s3: FakeS3;
  let smtp: Awaited<ReturnType<typeof startSmtpSink>>;
  let webA: RunningServer;
  let webB: RunningServer;
  const workers: Worker[] = [];
  let shared: Record<string, string>;

  beforeAll(async () => {
    s3 = await startFakeS3("kerfline-scale");
    smtp = await startSmtpSink();
    shared = {
      DATABASE_URL: await freshPostgresDatabase("scale_out"),
      KERFLINE_JOB_STALE_SECONDS: "10",
      AUTH_SECRET: "scale-out-test-secret-0123456789abcdef",
      SMTP_URL: smtp.url,
      KERFLINE_SEED: "demo-records",
      KERFLINE_MAIL_POLL_MS: "200",
      ...s3.env,
    };
    // One web server first: it applies the migrations and seeds; the rest start on a ready database.
    webA = await startServer({ env: { ...shared, KERFLINE_JOBS: "off" } });
    webB = await startServer({ env: { ...shared, KERFLINE_JOBS: "off" } });
    for (let i = 0; i < 2; i++) workers.push(spawnWorker({ ...shared, KERFLINE_DATA_DIR: tempDataDir("kerfline-worker-"), KERFLINE_WORKER_CONCURRENCY: "1" }));
  }, 240_000);

  // What the workers said, when a test fails: they run in processes of their own.
  beforeEach(() => onTestFailed(() => workers.forEach((w, i) => console.error(`--- worker ${i} ---\n${w.logs().slice(-4000)}`))));

  afterAll(async () => {
    for (const w of workers) if (w.proc.exitCode === null) w.proc.kill("SIGKILL");
    await webA?.stop();
    await webB?.stop();
    await smtp?.stop();
    await s3?.stop();
  });

  it("uploads through A, tiles on a worker, survives kill -9 of that worker, and serves through B only a whole pyramid", async () => {
    const onA = new ApiClient(webA.url);
    const onB = new ApiClient(webB.url);
    await onA.signIn(DEMO_EMAILS.analyst);
    await onB.signIn(DEMO_EMAILS.analyst);
    const teamId = (await onA.get<{ teams: { id: string; name: string }[] }>("/api/me")).body.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
    const c = await onA.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Scale-out case" });
    const d = await onA.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "scale-out die", widthUm: 4000, heightUm: 4000 });
    // Large enough that tiling takes seconds on this machine, so the kill lands mid-job.
    const cell = await sharp({ create: { width: 300, height: 300, channels: 3, background: { r: 110, g: 130, b: 95 } } })
      .composite([{ input: { create: { width: 120, height: 80, channels: 3, background: { r: 225, g: 205, b: 130 } } }, left: 40, top: 60 }])
      .png()
      .toBuffer();
    const jpeg = await sharp({ create: { width: 12_000, height: 12_000, channels: 3, background: { r: 40, g: 50, b: 45 } }, limitInputPixels: false })
      .composite([{ input: cell, tile: true }])
      .jpeg({ quality: 85 })
      .toBuffer();
    const form = new FormData();
    form.set("scaleUmPerPx", "0.33");
    form.set("illumination", "bright_field");
    form.set("file", new Blob([new Uint8Array(jpeg)], { type: "image/jpeg" }), "die.jpg");
    const up = await onA.upload<{ id: string }>(`/api/dies/${d.body.id}/micrographs`, form);
    expect(up.status).toBe(202);
    const id = up.body.id;

    // Through B, the whole time: info.json is 409 until the pyramid is complete, then 200.
    const seen: number[] = [];
    let watching = true;
    const watcher = (async () => {
      while (watching) {
        const r = await fetch(`${webB.url}/api/micrographs/${id}/iiif/info.json`, { headers: { cookie: onB.cookie } });
        seen.push(r.status);
        await r.arrayBuffer();
        if (r.status === 200) return;
        await new Promise((res) => setTimeout(res, 300));
      }
    })().catch(() => {});

    // The worker holding the job is the one burning CPU; kill it without warning.
    try {
      await until("tiling to start", async () => (await onB.get<{ status: string }>(`/api/micrographs/${id}`)).body.status === "tiling", 120_000);
      const before = workers.map((w) => cpuTicks(w.proc.pid!));
      await new Promise((r) => setTimeout(r, 1500));
      const busy = workers.map((w, i) => cpuTicks(w.proc.pid!) - before[i]);
      const victim = busy[0] >= busy[1] ? 0 : 1;
      workers[victim].proc.kill("SIGKILL");
      await workers[victim].exited;
      // The kill landed mid-job (else this test would prove nothing).
      expect((await onB.get<{ status: string }>(`/api/micrographs/${id}`)).body.status).toBe("tiling");

      const done = await until(
        "the other worker to finish the job",
        async () => {
          const m = (await onB.get<{ status: string; error: string | null }>(`/api/micrographs/${id}`)).body;
          return m.status === "ready" || m.status === "failed" ? m : undefined;
        },
        300_000,
      );
      expect(done).toMatchObject({ status: "ready" });
      await watcher;
    } finally {
      watching = false;
    }
    expect(seen.filter((s) => s !== 409 && s !== 200)).toEqual([]);
    expect(seen.at(-1)).toBe(200);
    // A full-resolution tile decodes as a 512-px JPEG (sharp is the outside decoder).
    const r = await fetch(`${webB.url}/api/micrographs/${id}/iiif/0,0,512,512/512,512/0/default.jpg`, { headers: { cookie: onB.cookie } });
    expect(r.status).toBe(200);
    const meta = await sharp(Buffer.from(await r.arrayBuffer())).metadata();
    expect(meta).toMatchObject({ format: "jpeg", width: 512, height: 512 });
  }, 420_000);

  it("lets exactly one of two concurrent edits of one shape through A and B win (the other 409)", async () => {
    const onA = new ApiClient(webA.url);
    const onB = new ApiClient(webB.url);
    await onA.signIn(DEMO_EMAILS.analyst);
    await onB.signIn(DEMO_EMAILS.analyst);
    const teamId = (await onA.get<{ teams: { id: string; name: string }[] }>("/api/me")).body.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
    const c = await onA.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Concurrent edit case" });
    const d = await onA.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "edit die", widthUm: 1000, heightUm: 1000 });
    const padId = await addPad(onA, d.body.id);
    const version = (await onB.get<{ version: number }>(`/api/markup/${padId}`)).body.version;
    const [a, b] = await Promise.all([
      onA.request("PATCH", `/api/markup/${padId}`, { version, properties: { label: "from A" } }),
      onB.request("PATCH", `/api/markup/${padId}`, { version, properties: { label: "from B" } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
  });

  it("mails a mention once, not once per process", async () => {
    const reviewer = new ApiClient(webB.url);
    await reviewer.signIn(DEMO_EMAILS.reviewer);
    const analyst = new ApiClient(webA.url);
    await analyst.signIn(DEMO_EMAILS.analyst);
    const teamId = (await analyst.get<{ teams: { id: string; name: string }[] }>("/api/me")).body.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
    const c = await analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Mention case" });
    const d = await analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "mention die", widthUm: 1000, heightUm: 800 });
    const words = `bond lift near VB2 ${Date.now()}`;
    const t = await reviewer.request("POST", `/api/dies/${d.body.id}/threads`, { region: square(100, 100), body: `@Demo Analyst ${words}` });
    expect(t.status).toBe(201);
    await until("the mention mail", async () => smtp.received.some((m) => m.to.includes(DEMO_EMAILS.analyst)), 60_000);
    // Several sender rounds on every process later, still one copy.
    await new Promise((r) => setTimeout(r, 3000));
    expect(smtp.received.filter((m) => m.to.includes(DEMO_EMAILS.analyst)).length).toBe(1);
  });

  it("resumes an upload begun on A through B (tus over the shared bucket and lock)", async () => {
    const onA = new ApiClient(webA.url);
    const onB = new ApiClient(webB.url);
    await onA.signIn(DEMO_EMAILS.analyst);
    await onB.signIn(DEMO_EMAILS.analyst);
    const teamId = (await onA.get<{ teams: { id: string; name: string }[] }>("/api/me")).body.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
    const c = await onA.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Resumed upload case" });
    const d = await onA.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "resumed die", widthUm: 1000, heightUm: 1000 });
    const jpeg = await sharp({ create: { width: 1200, height: 900, channels: 3, background: "#000", noise: { type: "gaussian", mean: 120, sigma: 30 } } })
      .jpeg({ quality: 90 })
      .toBuffer();
    const half = Math.floor(jpeg.length / 2);
    const created = await tusClient(onA).create(jpeg.length, { dieId: d.body.id, filename: "resumed.jpg", scaleUmPerPx: "0.5" });
    expect(created.status).toBe(201);
    const location = created.location!;
    expect((await tusClient(onA).patch(location, 0, jpeg.subarray(0, half))).offset).toBe(half);
    // tus 1.0.0 §HEAD: the other server reports the offset the first one stored.
    expect((await tusClient(onB).head(location)).offset).toBe(half);
    const done = await tusClient(onB).patch<{ id: string; bytes: number }>(location, half, jpeg.subarray(half));
    expect(done.status).toBe(200);
    expect(done.body.bytes).toBe(jpeg.length);
    const m = await until("the resumed micrograph to tile", async () => {
      const r = (await onA.get<{ status: string }>(`/api/micrographs/${done.body.id}`)).body;
      return r.status === "ready" ? r : undefined;
    });
    expect(m.status).toBe("ready");
  }, 180_000);

  it("leaves nothing on the web servers' disks but scratch", () => {
    for (const web of [webA, webB]) {
      const stray = filesBelow(web.dataDir).filter((f) => !f.startsWith("scratch/"));
      expect(stray, `files on ${web.url}'s disk outside scratch/`).toEqual([]);
    }
  });
});
