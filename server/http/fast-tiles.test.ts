import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { approveTileReads, fastTile, withdrawTileReads, type ApprovedPyramid } from "./fast-tiles";

// The fast path behind a real HTTP server, with a fallback that stands in for Next.js. What it
// must keep: the bytes of the stored tile, the headers of the full route, If-None-Match → 304
// (RFC 9110 §13.1.2), and nothing served without an approval for this exact session cookie.
const ID = "0b6f8f2e-6a53-4c5e-9d1e-2f4a1c3b5d7e";
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-fast-tiles-"));
const tileBytes = Buffer.from("not really a jpeg, but bytes to compare");
let fallbacks = 0;
let url = "";
const server = http.createServer((req, res) => {
  if (fastTile(req, res)) return;
  fallbacks++;
  res.writeHead(418).end("full route");
});

const pyramid: ApprovedPyramid = {
  // 1024 × 1024 px, 512-px tiles: scale factors 1 and 2 (IIIF Image API 3.0 tile paths).
  description: { width: 1024, height: 1024, tileSize: 512, scaleFactors: [1, 2] },
  open: async (rel) => {
    const file = path.join(dir, rel);
    const st = await fs.promises.stat(file).catch(() => null);
    return st ? { body: fs.createReadStream(file), size: st.size } : null;
  },
};
const TILE = "0,0,512,512/512,512/0/default.jpg";
const cookie = "authjs.callback-url=x; authjs.session-token=abc.def";

beforeAll(async () => {
  fs.mkdirSync(path.join(dir, "0,0,512,512/512,512/0"), { recursive: true });
  fs.writeFileSync(path.join(dir, TILE), tileBytes);
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  url = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
});
afterAll(() => {
  server.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const get = (p: string, headers: Record<string, string> = {}, method = "GET") => fetch(`${url}${p}`, { headers, method });

describe("the tile fast path", () => {
  it("leaves a tile nobody approved to the full route", async () => {
    const before = fallbacks;
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie })).status).toBe(418);
    expect(fallbacks).toBe(before + 1);
  });

  it("serves an approved session the stored bytes with the full route's headers, and 304 for its ETag", async () => {
    approveTileReads(cookie, ID, pyramid);
    const res = await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie: "authjs.session-token=abc.def; other=1" });
    expect(res.status).toBe(200);
    expect(Buffer.from(await res.arrayBuffer())).toEqual(tileBytes);
    expect(res.headers.get("content-type")).toBe("image/jpeg");
    expect(res.headers.get("cache-control")).toBe("private, max-age=31536000, immutable");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("content-security-policy")).toMatch(/^default-src 'none'/);
    const etag = res.headers.get("etag")!;
    expect(etag).toBe(`"${ID}/0,0,512,512/512,512"`);
    const again = await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie, "if-none-match": etag });
    expect(again.status).toBe(304);
    const head = await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie }, "HEAD");
    expect(head.status).toBe(200);
    expect(head.headers.get("content-length")).toBe(String(tileBytes.length));
  });

  it("does not serve another session, a path that is no tile, a write, or a withdrawn or expired approval", async () => {
    approveTileReads(cookie, ID, pyramid);
    const before = fallbacks;
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie: "authjs.session-token=someone-else" })).status).toBe(418);
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}`)).status).toBe(418);
    expect((await get(`/api/micrographs/${ID}/iiif/0,0,500,512/500,512/0/default.jpg`, { cookie })).status).toBe(418);
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}?x=1`, { cookie })).status).toBe(418);
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie }, "DELETE")).status).toBe(418);
    withdrawTileReads(ID);
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie })).status).toBe(418);
    approveTileReads(cookie, ID, pyramid);
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(Date.now() + 11_000);
    expect((await get(`/api/micrographs/${ID}/iiif/${TILE}`, { cookie })).status).toBe(418);
    vi.useRealTimers();
    expect(fallbacks).toBe(before + 7);
  });

  it("answers 404 for an approved pyramid whose tile object is missing", async () => {
    approveTileReads(cookie, ID, pyramid);
    const res = await get(`/api/micrographs/${ID}/iiif/512,0,512,512/512,512/0/default.jpg`, { cookie });
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({ error: "That tile was not found." });
  });
});
