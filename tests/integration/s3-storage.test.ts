import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { S3Client, ListObjectsV2Command } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer, tempDataDir, type RunningServer } from "../support/server";
import { demoClients, type ApiClient } from "../support/client";
import { makeJpeg, uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { startFakeS3, type FakeS3 } from "../support/s3-fake";

/*
 * The real server with KERFLINE_STORAGE=s3 against s3rver (a separate implementation of the S3
 * API, started on a free port): every stored file lands in the bucket under the die's prefixes,
 * tiles and exports stream back from it, deleting the die empties those prefixes, and the
 * server's data dir holds only its scratch folder and the embedded database's own files.
 * References: IIIF Image API 3.0 (a region 0,0,512,512 at size 512,512 is a 512 × 512 JPEG),
 * RFC 9110 (ETag, If-None-Match → 304), the bucket's own listing (ListObjectsV2).
 */
let fake: FakeS3;
let server: RunningServer;
let dataDir: string;
let analyst: ApiClient;
let owner: ApiClient;
let s3: S3Client;
/** A bucket the app must create itself at start (HeadBucket → CreateBucket): s3rver starts with another. */
const BUCKET = "kerfline-made-by-app";

const bucketKeys = async (prefix = "") =>
  ((await s3.send(new ListObjectsV2Command({ Bucket: BUCKET, Prefix: prefix }))).Contents ?? []).map((o) => o.Key!).sort();

beforeAll(async () => {
  fake = await startFakeS3("kerfline-preexisting");
  dataDir = tempDataDir();
  server = await startServer({ dataDir, env: { ...fake.env, S3_BUCKET: BUCKET, KERFLINE_SEED: "demo-records" } });
  s3 = new S3Client({ endpoint: fake.endpoint, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });
  ({ analyst, owner } = await demoClients(server.url));
});
afterAll(async () => {
  s3?.destroy();
  await server?.stop();
  await fake?.stop();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

describe("storage in an S3-compatible bucket", () => {
  it("stores, serves and removes a die's files through the bucket, writing nothing else to the data dir", async () => {
    const teamId = (await owner.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
    const c = await owner.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Bucket case" });
    const d = await owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "bucket die" });
    const dieId = d.body.id;
    const image = await makeJpeg(1500, 1000);
    // Bad input first: refused with its reason, and nothing reaches the bucket.
    const cut = await analyst.upload<{ error: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(image.subarray(0, 4000), "cut.jpg"));
    expect(cut.status).toBe(422);
    expect(await bucketKeys(`originals/${dieId}/`)).toEqual([]);
    const up = await analyst.upload<{ id: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(image, "bucket.jpg", { scaleUmPerPx: "1" }));
    expect(up.status).toBe(202);
    const id = up.body.id;
    await waitForStatus(analyst, id, "ready");
    expect(await bucketKeys(`originals/${dieId}/`)).toEqual([`originals/${dieId}/${id}.jpg`]);
    expect(await bucketKeys(`tiles/${dieId}/`)).toEqual([
      `tiles/${dieId}/${id}-preview.jpg`,
      `tiles/${dieId}/${id}-thumb.jpg`,
      `tiles/${dieId}/${id}.tilepack`,
    ]);

    const info = await analyst.get<{ width: number; height: number }>(`/api/micrographs/${id}/iiif/info.json`);
    expect(info.status).toBe(200);
    expect(info.body).toMatchObject({ width: 1500, height: 1000 });

    const cookie = analyst.cookie;
    const tileUrl = `${server.url}/api/micrographs/${id}/iiif/0,0,512,512/512,512/0/default.jpg`;
    const tile = await fetch(tileUrl, { headers: { cookie } });
    expect(tile.status).toBe(200);
    expect(tile.headers.get("cache-control")).toBe("private, max-age=31536000, immutable");
    const body = Buffer.from(await tile.arrayBuffer());
    // No content-length check: `next start` sends a streamed route-handler body chunked and drops it.
    expect(await sharp(body).metadata()).toMatchObject({ format: "jpeg", width: 512, height: 512 });
    const etag = tile.headers.get("etag")!;
    const again = await fetch(tileUrl, { headers: { cookie, "if-none-match": etag } });
    expect(again.status).toBe(304);
    expect((await fetch(`${server.url}/api/micrographs/${id}/thumbnail`, { headers: { cookie } })).status).toBe(200);
    expect((await fetch(`${server.url}/api/micrographs/${id}/iiif/0,0,512,512/512,512/0/default.jpg`)).status).toBe(401);

    const post = await analyst.request<{ id: string }>("POST", `/api/dies/${dieId}/exports`, { micrographId: id, widthPx: 300 });
    expect(post.status).toBe(202);
    const deadline = Date.now() + 60_000;
    let status = "";
    while (status !== "done" && Date.now() < deadline) {
      const e = await analyst.get<{ status: string; error: string | null }>(`/api/exports/${post.body.id}`);
      status = e.body.status;
      if (status === "failed") throw new Error(`export failed: ${e.body.error}`);
      await new Promise((r) => setTimeout(r, 200));
    }
    expect(await bucketKeys(`exports/${dieId}/`)).toEqual([`exports/${dieId}/${post.body.id}.png`]);
    const png = await fetch(`${server.url}/api/exports/${post.body.id}/file`, { headers: { cookie } });
    expect(png.status).toBe(200);
    expect((await sharp(Buffer.from(await png.arrayBuffer())).metadata()).width).toBe(300);

    // The report is built on request from the stored preview (nothing stored for it).
    const report = await fetch(`${server.url}/api/dies/${dieId}/report.pdf`, { headers: { cookie } });
    expect(report.status).toBe(200);
    expect(
      Buffer.from(await report.arrayBuffer())
        .subarray(0, 5)
        .toString("latin1"),
    ).toBe("%PDF-");

    expect((await owner.request("DELETE", `/api/dies/${dieId}`)).status).toBe(204);
    // The tile was approved for the fast path and is hot in memory; deletion forgets both, so
    // it is gone at once, not after the approval lapses (ground truth: the die no longer exists).
    expect((await fetch(tileUrl, { headers: { cookie } })).status).toBe(404);
    for (const area of ["originals", "tiles", "exports"]) expect(await bucketKeys(`${area}/${dieId}/`)).toEqual([]);

    // Nothing but scratch (emptied after every job) and the embedded database's own files.
    const top = fs.readdirSync(dataDir).sort();
    expect(top.filter((n) => !["scratch", "pgdata", "auth-secret", "mail", "kerfline.lock"].includes(n) && !n.startsWith("."))).toEqual([]);
    const scratch = fs.readdirSync(path.join(dataDir, "scratch"), { recursive: true, withFileTypes: true }).filter((e) => e.isFile());
    expect(scratch.map((e) => e.name)).toEqual([]);
  }, 240_000);
});
