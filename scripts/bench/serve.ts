// Tile-serving benchmark: many concurrent clients reading a micrograph's tiles through the app
// (session cookie, team access check, the stored pyramid read from the object store) against a
// bare Node static file server on the same tiles, alternating in one run so machine noise hits
// both; on the local data dir and on an S3-compatible store (s3rver). Load comes from
// autocannon. Also the ingest time (upload → ready) on S3 against the local store.
import fs from "node:fs";
import { spawn } from "node:child_process";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import sharp from "sharp";
import { startServer, type RunningServer } from "../../tests/support/server";
import { demoClients, type ApiClient } from "../../tests/support/client";
import { startFakeS3 } from "../../tests/support/s3-fake";

const SIDE = 8192;
const TILE = 512; // the pyramid's tile size (DEFAULT_TILE_SIZE)
const CONNECTIONS = 32;
const SECONDS = 8;

/** A textured 8192² JPEG (cached between runs): enough tiles that reads are not one cached file. */
async function serveImage(): Promise<string> {
  const dir = path.join(os.tmpdir(), "kerfline-bench");
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `serve-${SIDE}.jpg`);
  if (fs.existsSync(file)) return file;
  const noise = Buffer.alloc(256 * 256 * 3);
  for (let i = 0; i < noise.length; i++) noise[i] = (i * 2654435761) >>> 24;
  const cell = await sharp(noise, { raw: { width: 256, height: 256, channels: 3 } })
    .png()
    .toBuffer();
  await sharp({ create: { width: SIDE, height: SIDE, channels: 3, background: { r: 60, g: 70, b: 65 } } })
    .composite([{ input: cell, tile: true, blend: "overlay" }])
    .jpeg({ quality: 90 })
    .toFile(`${file}.partial.jpg`);
  fs.renameSync(`${file}.partial.jpg`, file);
  return file;
}

type Uploaded = { client: ApiClient; cookie: string; micrographId: string; ingestSeconds: number };

async function uploadAndWait(server: RunningServer, image: string): Promise<Uploaded> {
  const { analyst } = await demoClients(server.url);
  const teamId = (await analyst.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
  const c = await analyst.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Serve bench" });
  const d = await analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "bench die" });
  const form = new FormData();
  form.set("scaleUmPerPx", "0.5");
  form.set("illumination", "bright_field");
  form.set("file", new Blob([fs.readFileSync(image)], { type: "image/jpeg" }), "serve.jpg");
  const t0 = performance.now();
  const up = await analyst.upload<{ id: string }>(`/api/dies/${d.body.id}/micrographs`, form);
  if (up.status !== 202 && up.status !== 201) throw new Error(`upload answered ${up.status}: ${JSON.stringify(up.body)}`);
  for (;;) {
    const m = await analyst.get<{ status: string; error?: string }>(`/api/micrographs/${up.body.id}`);
    if (m.body.status === "ready") break;
    if (m.body.status === "failed") throw new Error(`tiling failed: ${m.body.error}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  const ingestSeconds = (performance.now() - t0) / 1000;
  const cookie = (analyst as unknown as { cookieHeader(): string }).cookieHeader();
  return { client: analyst, cookie, micrographId: up.body.id, ingestSeconds };
}

/** Every full-resolution tile path (IIIF region/size) of an image of this size. */
function tilePaths(width: number, height: number): string[] {
  const paths: string[] = [];
  for (let y = 0; y < height; y += TILE) {
    for (let x = 0; x < width; x += TILE) {
      const w = Math.min(TILE, width - x);
      const h = Math.min(TILE, height - y);
      paths.push(`/${x},${y},${w},${h}/${w},${h}/0/default.jpg`);
    }
  }
  return paths;
}

/**
 * A bare static server: the same tiles from sharp's own IIIF folder, no session, no lookup. A
 * process of its own, like the app, so it does not share an event loop with the load generator.
 */
async function staticServer(folder: string): Promise<{ url: string; close(): Promise<void> }> {
  const code = `
    const http = require("node:http"), fs = require("node:fs"), path = require("node:path");
    const root = process.argv[1];
    const server = http.createServer((req, res) => {
      const file = path.join(root, decodeURIComponent(req.url.split("?")[0]));
      if (!file.startsWith(root)) return void res.writeHead(400).end();
      fs.stat(file, (err, st) => {
        if (err || !st.isFile()) return void res.writeHead(404).end();
        res.writeHead(200, { "content-type": "image/jpeg", "content-length": st.size, "cache-control": "private, max-age=31536000, immutable" });
        fs.createReadStream(file).pipe(res);
      });
    });
    server.keepAliveTimeout = 65000;
    server.listen(0, "127.0.0.1", () => console.log(server.address().port));`;
  const child = spawn(process.execPath, ["-e", code, folder], { stdio: ["ignore", "pipe", "inherit"] });
  const port = await new Promise<number>((resolve) => child.stdout!.once("data", (d) => resolve(Number(String(d).trim()))));
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise((r) => {
        child.once("exit", () => r());
        child.kill();
      }),
  };
}

type Load = { rps: number; p50: number; p99: number; errors: number; non2xx: number };

async function load(base: string, paths: string[], headers: Record<string, string> = {}): Promise<Load> {
  const result = await autocannon({
    url: base,
    connections: CONNECTIONS,
    duration: SECONDS,
    // Load from worker threads, so the generator's own JavaScript is not what limits the rate.
    workers: 2,
    headers,
    requests: paths.map((p) => ({ method: "GET", path: p })),
  });
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, errors: result.errors + result.timeouts, non2xx: result.non2xx };
}

const fmt = (l: Load) => `${l.rps.toFixed(0)} req/s, p50 ${l.p50} ms, p99 ${l.p99} ms, errors ${l.errors}, non-2xx ${l.non2xx}`;

async function benchOne(storage: "local" | "s3", image: string, folder: string, paths: string[]): Promise<number> {
  const s3 = storage === "s3" ? await startFakeS3("kerfline-bench") : null;
  const server = await startServer({ env: { KERFLINE_SEED: "demo-records", ...(s3?.env ?? {}) } });
  const bare = await staticServer(folder);
  try {
    const up = await uploadAndWait(server, image);
    const appPaths = paths.map((p) => `/api/micrographs/${up.micrographId}/iiif${p}`);
    const headers = { cookie: up.cookie };
    // Warm both (route compiled, pack index cached, page cache filled) before measuring.
    await load(server.url, appPaths.slice(0, 64), headers);
    await load(bare.url, paths.slice(0, 64));
    const ours: Load[] = [];
    const theirs: Load[] = [];
    for (let round = 0; round < 2; round++) {
      theirs.push(await load(bare.url, paths));
      ours.push(await load(server.url, appPaths, headers));
    }
    const best = (xs: Load[]) => xs.reduce((a, b) => (b.rps > a.rps ? b : a));
    const o = best(ours);
    const t = best(theirs);
    const errors = ours.reduce((n, l) => n + l.errors + l.non2xx, 0);
    const ratio = o.rps / t.rps;
    console.log(
      `  ${storage === "s3" ? "S3 (s3rver)" : "local data dir"}: ${CONNECTIONS} connections × ${SECONDS} s, ${paths.length} distinct tiles, 2 alternating rounds (best of each)`,
    );
    console.log(`    kerfline (signed in, access check, object store): ${fmt(o)}`);
    console.log(`    bare Node static server, same tiles:               ${fmt(t)}`);
    console.log(`    throughput ratio ${ratio.toFixed(2)} (target ≥ 0.5, 0 errors) ${ratio >= 0.5 && errors === 0 ? "MET" : "NOT MET"}`);
    return up.ingestSeconds;
  } finally {
    await bare.close();
    await server.stop();
    await s3?.stop();
  }
}

/** Prints tile-serving throughput ratios on both stores and the S3/local ingest ratio. */
export async function benchServe() {
  const image = await serveImage();
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-bench-static-"));
  try {
    // The same encoder settings as the tiler (server/images/pyramid.ts): the same tile bytes.
    await sharp(image, { limitInputPixels: false })
      .jpeg({ quality: 85, optimiseCoding: false })
      .tile({ layout: "iiif3", size: TILE, overlap: 0 })
      .toFile(path.join(folder, "p"));
    const paths = tilePaths(SIDE, SIDE);
    console.log(`\nTile serving (${SIDE} × ${SIDE} px JPEG, ${TILE}-px tiles, autocannon)`);
    const local = await benchOne("local", image, path.join(folder, "p"), paths);
    const s3 = await benchOne("s3", image, path.join(folder, "p"), paths);
    const ratio = s3 / local;
    console.log(
      `  ingest (upload → ready) local ${local.toFixed(1)} s, S3 ${s3.toFixed(1)} s: ratio ${ratio.toFixed(2)} (target ≤ 1.5) ${ratio <= 1.5 ? "MET" : "NOT MET"}`,
    );
  } finally {
    fs.rmSync(folder, { recursive: true, force: true });
  }
}
