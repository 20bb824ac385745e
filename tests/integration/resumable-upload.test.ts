import crypto from "node:crypto";
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { once } from "node:events";
import { pipeline } from "node:stream/promises";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { demoWorld, freshCase } from "./fixtures";
import { demoClients, type ApiClient } from "../support/client";
import { makeJpeg, makePng } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { badMicrographs } from "../support/bad-micrographs";
import { sparseTiff } from "../support/sparse-tiff";
import { tusClient, TUS_VERSION } from "../support/tus-client";
import { startServer, type RunningServer } from "../support/server";
import { startFakeS3, type FakeS3 } from "../support/s3-fake";

// Resumable uploads (issue #16): the tus 1.0.0 protocol, https://tus.io/protocols/resumable-upload
// ("tus §…" below), driven by our own small client; file contents checked by SHA-256
// (FIPS 180-4, node:crypto) against the bytes the test generated.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let jpeg: Buffer;
let png: Buffer;
const CHUNK = 8 * 1024 ** 2;
/** Size of the big upload: 1 GiB unless KERFLINE_TUS_TEST_BYTES says otherwise (even, ≥ 1 MB). */
const BIG = Number(process.env.KERFLINE_TUS_TEST_BYTES ?? 1024 ** 3);
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
const dataDir = () => inject("dataDir");

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Resumable upload target"));
  jpeg = await makeJpeg(1500, 1000);
  png = await makePng(800, 600);
});

const uploadsLeft = (dir = dataDir()) => (fs.existsSync(path.join(dir, "uploads")) ? fs.readdirSync(path.join(dir, "uploads")) : []);

function filesLeft(die = dieId, dir = dataDir()): string[] {
  const out: string[] = [];
  for (const area of ["originals", "tiles"]) {
    const root = path.join(dir, area, die);
    if (fs.existsSync(root)) out.push(...fs.readdirSync(root, { recursive: true }).map((n) => `${area}/${n}`));
  }
  const incoming = path.join(dir, "originals", ".incoming");
  if (fs.existsSync(incoming)) out.push(...fs.readdirSync(incoming).map((n) => `incoming/${n}`));
  return [...out, ...uploadsLeft(dir).map((n) => `uploads/${n}`)];
}

const count = async (die = dieId, client = world.clients.owner) => (await client.get<unknown[]>(`/api/dies/${die}/micrographs`)).body.length;
const idOf = (location: string) => location.split("/").pop()!;

async function until(what: string, ok: () => boolean | Promise<boolean>, ms: number) {
  const start = Date.now();
  while (!(await ok())) {
    if (Date.now() - start > ms) throw new Error(`${what} did not happen within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return Date.now() - start;
}

describe("the tus protocol on /api/uploads", () => {
  it("creates an upload with a UUID id, tells its offset by HEAD, refuses a wrong offset and records the micrograph after the last byte", async () => {
    const tus = tusClient(world.clients.analyst);
    const created = await tus.create(jpeg.length, { dieId, filename: "bf-20x.jpg", illumination: "bright_field", objectiveMag: "20", cameraPixelPitchUm: "5" });
    // tus §Creation: 201 Created with the new upload's URL in Location; every answer carries Tus-Resumable.
    expect(created.status).toBe(201);
    expect(created.headers.get("tus-resumable")).toBe("1.0.0");
    expect(created.location).toMatch(/^\/api\/uploads\/[0-9a-f-]{36}$/);
    expect(idOf(created.location!)).toMatch(UUID);
    const loc = created.location!;
    // tus §HEAD: Upload-Offset of the bytes held, Upload-Length when known, Cache-Control: no-store.
    const fresh = await tus.head(loc);
    expect(fresh.status).toBe(200);
    expect(fresh.offset).toBe(0);
    expect(fresh.headers.get("upload-length")).toBe(String(jpeg.length));
    expect(fresh.headers.get("cache-control")).toBe("no-store");
    // tus §PATCH: an Upload-Offset that is not the held offset answers 409 Conflict, nothing changed.
    const wrong = await tus.patch<{ error: string }>(loc, 5, jpeg.subarray(5, 100));
    expect(wrong.status).toBe(409);
    expect(wrong.body.error).toMatch(/Upload-Offset/);
    expect((await tus.head(loc)).offset).toBe(0);
    const half = Math.floor(jpeg.length / 2);
    // tus §PATCH: 204 with the new offset.
    const first = await tus.patch(loc, 0, jpeg.subarray(0, half));
    expect(first.status).toBe(204);
    expect(first.offset).toBe(half);
    expect((await tus.head(loc)).offset).toBe(half);
    expect(await count()).toBe(0);
    const last = await tus.patch<{ id: string; dieId: string; bytes: number; format: string; width: number; scaleUmPerPx: number; label: string }>(
      loc,
      half,
      jpeg.subarray(half),
    );
    expect(last.status).toBe(200);
    expect(last.offset).toBe(jpeg.length);
    expect(last.body).toMatchObject({ dieId, bytes: jpeg.length, format: "jpeg", width: 1500, height: 1000, label: "bf-20x" });
    // 5 µm camera pixels at 20x give 0.25 µm/px (pixel pitch ÷ magnification, as the multipart test).
    expect(last.body.scaleUmPerPx).toBeCloseTo(0.25, 12);
    // Consistency check: the answer is the same DTO the micrograph API serves.
    const served = await world.clients.analyst.get<Record<string, unknown>>(`/api/micrographs/${last.body.id}`);
    expect(Object.keys(last.body).sort()).toEqual(Object.keys(served.body).sort());
    // The stored original is the sent file, byte for byte.
    const original = path.join(dataDir(), "originals", dieId, `${last.body.id}.jpg`);
    expect(sha256(fs.readFileSync(original))).toBe(sha256(jpeg));
    // The finished upload is gone from the scratch store.
    expect((await tus.head(loc)).status).toBe(404);
    expect(uploadsLeft()).toEqual([]);
    await waitForStatus(world.clients.analyst, last.body.id, "ready");
    expect((await world.clients.analyst.request("DELETE", `/api/micrographs/${last.body.id}`)).status).toBe(204);
    expect(filesLeft()).toEqual([]);
  });

  it("answers 412 to a request without Tus-Resumable, as JSON", async () => {
    // tus §Tus-Resumable: it MUST be in every request but OPTIONS; 412 Precondition Failed otherwise.
    const res = await fetch(`${inject("baseUrl")}/api/uploads`, {
      method: "POST",
      headers: { cookie: world.clients.analyst.cookie, "Upload-Length": "10" },
    });
    expect(res.status).toBe(412);
    expect(res.headers.get("content-type")).toBe("application/json");
    expect(((await res.json()) as { error: string }).error).toMatch(/Tus-Resumable/);
  });

  it("refuses a signed-out caller 401, an outsider 404, a reviewer or viewer 403 and a file over the limit 413 before storing anything", async () => {
    for (const [who, status] of [
      ["anonymous", 401],
      ["outsider", 404],
      ["reviewer", 403],
      ["viewer", 403],
    ] as const) {
      const res = await tusClient(world.clients[who]).create<{ error: string }>(jpeg.length, { dieId, filename: "die.jpg" });
      expect(res.status, who).toBe(status);
      expect(typeof res.body.error).toBe("string");
      expect(res.location).toBeNull();
    }
    // KERFLINE_MAX_UPLOAD_BYTES defaults to 8 GiB.
    const big = await tusClient(world.clients.analyst).create<{ error: string }>(9 * 1024 ** 3, { dieId, filename: "die.tif" });
    expect(big.status).toBe(413);
    expect(big.body.error).toMatch(/larger than the limit of 8 GB/);
    expect(uploadsLeft()).toEqual([]);
    expect(await count()).toBe(0);
  });

  it("lets only the creator HEAD, PATCH or DELETE an upload, even the team's owner gets 404", async () => {
    const mine = tusClient(world.clients.analyst);
    const loc = (await mine.create(jpeg.length, { dieId, filename: "die.jpg" })).location!;
    const theirs = tusClient(world.clients.owner);
    expect((await theirs.head(loc)).status).toBe(404);
    expect((await theirs.patch(loc, 0, jpeg.subarray(0, 1000))).status).toBe(404);
    expect((await theirs.terminate(loc)).status).toBe(404);
    expect((await mine.head(loc)).offset).toBe(0);
    // tus §Termination: DELETE answers 204 and the upload is gone (404 afterwards).
    expect((await mine.terminate(loc)).status).toBe(204);
    expect((await mine.head(loc)).status).toBe(404);
    expect(uploadsLeft()).toEqual([]);
    expect(await count()).toBe(0);
  });
});

describe("the bad-file corpus through a tus upload", () => {
  for (const c of badMicrographs(() => ({ jpeg, png }))) {
    it(`answers ${c.status} for ${c.name}, with the multipart route's message, and leaves nothing`, async () => {
      const tus = tusClient(world.clients.analyst);
      const bytes = c.bytes();
      const created = await tus.create<{ error: string }>(bytes.length, { dieId, filename: c.fileName, ...c.fields });
      let refusal = created;
      if (created.status === 201) {
        refusal = await tus.patch<{ error: string }>(created.location!, 0, bytes);
        expect((await tus.head(created.location!)).status).toBe(404);
      }
      expect(refusal.status).toBe(c.status);
      expect(refusal.body.error).toMatch(c.message);
      expect(await count()).toBe(0);
      expect(filesLeft()).toEqual([]);
    });
  }

  it("refuses a non-image at its first bytes, before the rest arrives", async () => {
    const tus = tusClient(world.clients.analyst);
    const text = Buffer.from("<!doctype html>".padEnd(4096, " "));
    const loc = (await tus.create(10 * 1024 ** 2, { dieId, filename: "page.jpg" })).location!;
    // Only 4 KiB of the declared 10 MiB are sent: the refusal comes from the first bytes.
    const res = await tus.patch<{ error: string }>(loc, 0, text);
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(/Only JPEG/);
    expect(filesLeft()).toEqual([]);
  });
});

describe("a big upload cut at about half", () => {
  it(`resumes from the offset HEAD gives and arrives whole (${BIG} bytes, SHA-256 equal), sending no more than the missing bytes plus one chunk`, async () => {
    const tiff = sparseTiff(BIG);
    const sourceHash = tiff.sha256();
    const tus = tusClient(world.clients.analyst);
    const created = await tus.create(BIG, { dieId, filename: "whole-die.tif", illumination: "dark_field" });
    expect(created.status).toBe(201);
    const loc = created.location!;
    const storeFile = path.join(dataDir(), "uploads", idOf(loc));

    // Part one: one PATCH announcing every byte, cut mid-stream after about half.
    const u = new URL(tus.url(loc));
    const req = http.request({
      hostname: u.hostname,
      port: u.port,
      method: "PATCH",
      path: u.pathname,
      headers: {
        cookie: world.clients.analyst.cookie,
        ...TUS_VERSION,
        "Upload-Offset": "0",
        "Content-Type": "application/offset+octet-stream",
        "Content-Length": String(BIG),
      },
    });
    req.on("error", () => {});
    const half = Math.floor(BIG / 2);
    let sent = 0;
    while (sent < half) {
      const end = Math.min(half, sent + CHUNK);
      const flowing = req.write(tiff.slice(sent, end));
      sent = end;
      if (!flowing) await once(req, "drain");
    }
    // Let the bytes already on their way land, then drop the connection with the request unfinished.
    await until("the sent bytes to reach the store", () => fs.existsSync(storeFile) && fs.statSync(storeFile).size >= sent - CHUNK, 60_000);
    await new Promise((r) => setTimeout(r, 500));
    req.destroy();
    expect(await count()).toBe(0);

    // tus §HEAD: the offset the server holds after the cut.
    const held = await tus.head(loc);
    expect(held.status).toBe(200);
    const offset = held.offset!;
    const missing = BIG - sent;
    expect(offset).toBeGreaterThan(0);
    expect(offset).toBeLessThanOrEqual(sent);

    // Part two: PATCHes of one chunk each from that offset (tus §PATCH: 204 and the new offset).
    let sentAgain = 0;
    let last: { status: number; body: { id: string; bytes: number; format: string } } | null = null;
    for (let o = offset; o < BIG; o += CHUNK) {
      const end = Math.min(BIG, o + CHUNK);
      const res = await tus.patch<{ id: string; bytes: number; format: string }>(loc, o, tiff.slice(o, end));
      sentAgain += end - o;
      expect(res.offset).toBe(end);
      if (end < BIG) expect(res.status).toBe(204);
      else last = res;
    }
    console.info(`[tus] ${BIG} bytes: cut after ${sent}, server held ${offset}, part two sent ${sentAgain} (missing ${missing} + chunk ${CHUNK})`);
    expect(sentAgain).toBe(BIG - offset);
    expect(sentAgain).toBeLessThanOrEqual(missing + CHUNK);
    expect(last!.status).toBe(200);
    expect(last!.body).toMatchObject({ bytes: BIG, format: "tiff" });

    // Outside check: the recorded original's SHA-256 equals the generated file's.
    const original = path.join(dataDir(), "originals", dieId, `${last!.body.id}.tif`);
    const h = crypto.createHash("sha256");
    await pipeline(fs.createReadStream(original), h);
    expect(h.digest("hex")).toBe(sourceHash);
    expect(uploadsLeft()).toEqual([]);
    await waitForStatus(world.clients.analyst, last!.body.id, "ready");
    expect((await world.clients.analyst.request("DELETE", `/api/micrographs/${last!.body.id}`)).status).toBe(204);
    expect(filesLeft()).toEqual([]);
  }, 600_000);
});

describe("an abandoned upload", () => {
  let server: RunningServer;
  let clients: Awaited<ReturnType<typeof demoClients>>;
  beforeAll(async () => {
    // Expiry of 0.002 h = 7.2 s; the housekeeping job sweeps uploads every 15 s (KERFLINE_JOB_STALE_SECONDS / 4).
    server = await startServer({ env: { KERFLINE_SEED: "demo-records", KERFLINE_UPLOAD_EXPIRY_HOURS: "0.002" } });
    clients = await demoClients(server.url);
  }, 180_000);
  afterAll(async () => server?.stop());

  it("records nothing and is removed with its bytes by the sweep after the expiry", async () => {
    const { dieId: die } = await freshCase(clients.owner, await teamOf(clients.owner));
    const tus = tusClient(clients.analyst);
    const loc = (await tus.create(jpeg.length, { dieId: die, filename: "die.jpg" })).location!;
    expect((await tus.patch(loc, 0, jpeg.subarray(0, 40_000))).offset).toBe(40_000);
    expect(uploadsLeft(server.dataDir).sort()).toEqual([idOf(loc), `${idOf(loc)}.json`].sort());
    const took = await until("the sweep to remove the upload", () => uploadsLeft(server.dataDir).length === 0, 60_000);
    console.info(`[tus] abandoned upload removed ${took} ms after its last byte (expiry 7.2 s)`);
    // tus §HEAD: 404 (or 410 Gone) for an upload the server no longer has.
    expect([404, 410]).toContain((await tus.head(loc)).status);
    expect(await count(die, clients.owner)).toBe(0);
    expect(filesLeft(die, server.dataDir)).toEqual([]);
  });
});

describe("on S3 storage", () => {
  let s3: FakeS3;
  let server: RunningServer;
  let clients: Awaited<ReturnType<typeof demoClients>>;
  beforeAll(async () => {
    s3 = await startFakeS3();
    server = await startServer({ env: { KERFLINE_SEED: "demo-records", ...s3.env } });
    clients = await demoClients(server.url);
  }, 180_000);
  afterAll(async () => {
    await server?.stop();
    await s3?.stop();
  });

  const uploadObjects = async () => {
    const client = new S3Client({
      endpoint: s3.endpoint,
      region: "us-east-1",
      forcePathStyle: true,
      credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
    });
    const listed = await client.send(new ListObjectsV2Command({ Bucket: s3.bucket, Prefix: "uploads/" }));
    return (listed.Contents ?? []).map((o) => o.Key);
  };

  it("takes an upload in two PATCHes end to end and leaves no upload object in the bucket", async () => {
    const { dieId: die } = await freshCase(clients.owner, await teamOf(clients.owner));
    const tus = tusClient(clients.analyst);
    const loc = (await tus.create(jpeg.length, { dieId: die, filename: "s3.jpg" })).location!;
    const half = Math.floor(jpeg.length / 2);
    expect((await tus.patch(loc, 0, jpeg.subarray(0, half))).offset).toBe(half);
    expect((await tus.head(loc)).offset).toBe(half);
    expect((await uploadObjects()).length).toBeGreaterThan(0);
    const last = await tus.patch<{ id: string; bytes: number }>(loc, half, jpeg.subarray(half));
    expect(last.status).toBe(200);
    expect(last.body.bytes).toBe(jpeg.length);
    expect(await uploadObjects()).toEqual([]);
    expect((await tus.head(loc)).status).toBe(404);
    expect(await count(die, clients.owner)).toBe(1);
  });

  it("refuses a truncated JPEG after the upload (422) and leaves no object or row", async () => {
    const { dieId: die } = await freshCase(clients.owner, await teamOf(clients.owner));
    const tus = tusClient(clients.analyst);
    const cut = jpeg.subarray(0, Math.floor(jpeg.length * 0.6));
    const loc = (await tus.create(cut.length, { dieId: die, filename: "cut.jpg" })).location!;
    const res = await tus.patch<{ error: string }>(loc, 0, cut);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/incomplete/);
    expect(await uploadObjects()).toEqual([]);
    expect(await count(die, clients.owner)).toBe(0);
    expect(filesLeft(die, server.dataDir)).toEqual([]);
  });
});

async function teamOf(owner: ApiClient): Promise<string> {
  const me = (await owner.get<{ teams: { id: string; name: string }[] }>("/api/me")).body;
  return me.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
}

function sha256(b: Buffer): string {
  return crypto.createHash("sha256").update(b).digest("hex");
}
