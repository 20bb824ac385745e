import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { makeJpeg, makePng, uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { badMicrographs } from "../support/bad-micrographs";

// Bad uploads: each refused with a clear status and message, leaving no row and no file.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let jpeg: Buffer;
let png: Buffer;
const dataDir = () => inject("dataDir");

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Upload target"));
  jpeg = await makeJpeg(1500, 1000);
  png = await makePng(800, 600);
});

function filesLeft(): string[] {
  const out: string[] = [];
  for (const area of ["originals", "tiles"]) {
    const walk = (d: string) => {
      if (!fs.existsSync(d)) return;
      for (const e of fs.readdirSync(d, { withFileTypes: true })) {
        const p = path.join(d, e.name);
        if (e.isDirectory()) walk(p);
        else out.push(path.relative(dataDir(), p));
      }
    };
    walk(path.join(dataDir(), area, dieId));
  }
  const incoming = path.join(dataDir(), "scratch", "incoming");
  if (fs.existsSync(incoming)) out.push(...fs.readdirSync(incoming).map((n) => `incoming/${n}`));
  return out;
}

const count = async () => (await world.clients.owner.get<unknown[]>(`/api/dies/${dieId}/micrographs`)).body.length;

type BadCase = { name: string; form: () => FormData; status: number; message: RegExp };
// The file-level corpus is shared with the resumable-upload tests; the last two are multipart-only.
const CORPUS: BadCase[] = [
  ...badMicrographs(() => ({ jpeg, png })).map((b) => ({ ...b, form: () => uploadForm(b.bytes(), b.fileName, b.fields) })),
  { name: "a missing file", form: () => uploadForm(null, "", { label: "no file" }), status: 400, message: /No file was sent/ },
  {
    name: "a file in the wrong field",
    form: () => {
      const f = new FormData();
      f.append("image", new Blob([new Uint8Array(jpeg)]), "die.jpg");
      return f;
    },
    status: 400,
    message: /field “file”/,
  },
];

describe("POST /api/dies/{dieId}/micrographs refuses bad uploads", () => {
  for (const c of CORPUS) {
    it(`answers ${c.status} for ${c.name}, with a message, and leaves nothing`, async () => {
      const before = await count();
      const res = await world.clients.analyst.upload<{ error: string }>(`/api/dies/${dieId}/micrographs`, c.form());
      expect(res.status).toBe(c.status);
      expect(res.body.error).toMatch(c.message);
      expect(await count()).toBe(before);
      expect(filesLeft()).toEqual([]);
    });
  }

  it("answers 415 for a body that is not multipart", async () => {
    const res = await world.clients.analyst.request<{ error: string }>("POST", `/api/dies/${dieId}/micrographs`, { file: "x" });
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(/multipart/);
  });

  it("answers 404 for another team's die and 403 for a reviewer or viewer, before reading the file", async () => {
    for (const [who, status] of [
      ["outsider", 404],
      ["reviewer", 403],
      ["viewer", 403],
      ["anonymous", 401],
    ] as const) {
      const res = await world.clients[who].upload<{ error: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(jpeg, "die.jpg"));
      expect(res.status).toBe(status);
      expect(typeof res.body.error).toBe("string");
    }
    expect(await count()).toBe(0);
    expect(filesLeft()).toEqual([]);
  });
});

describe("an accepted upload", () => {
  it("answers 202, tiles in the background and serves IIIF tiles to members only", async () => {
    const res = await world.clients.analyst.upload<{ id: string; status: string; scaleUmPerPx: number; transform: number[][] }>(
      `/api/dies/${dieId}/micrographs`,
      uploadForm(jpeg, "bf-10x.jpg", { illumination: "bright_field", objectiveMag: "20", cameraPixelPitchUm: "5", numericalAperture: "0.45" }),
    );
    expect(res.status).toBe(202);
    // Queued when answered, unless an idle worker claimed it first (seen on a quiet PostgreSQL run).
    expect(["queued", "tiling"]).toContain(res.body.status);
    // REFERENCES.md: 5 µm camera pixels at 20x give 0.25 µm/px [pub].
    expect(res.body.scaleUmPerPx).toBeCloseTo(0.25, 12);
    // The first micrograph defines the die frame: x right, y up (negative determinant).
    expect(res.body.transform).toEqual([
      [0.25, 0, 0],
      [0, -0.25, 250],
    ]);
    const ready = await waitForStatus(world.clients.analyst, res.body.id, "ready");
    expect(ready).toMatchObject({ dieId, width: 1500, height: 1000, progress: 100, illumination: "bright_field", objectiveMag: 20, numericalAperture: 0.45 });

    const info = await world.clients.viewer.get<Record<string, unknown>>(`/api/micrographs/${res.body.id}/iiif/info.json`);
    expect(info.status).toBe(200);
    expect(info.body).toMatchObject({
      "@context": "http://iiif.io/api/image/3/context.json",
      type: "ImageService3",
      protocol: "http://iiif.io/api/image",
      profile: "level0",
      width: 1500,
      height: 1000,
    });
    expect(info.body.id).toBe(`${inject("baseUrl")}/api/micrographs/${res.body.id}/iiif`);

    const tilePath = `/api/micrographs/${res.body.id}/iiif/0,0,512,512/512,512/0/default.jpg`;
    const tile = await fetch(`${inject("baseUrl")}${tilePath}`, { headers: { cookie: await cookieOf("viewer") } });
    expect(tile.status).toBe(200);
    expect(tile.headers.get("content-type")).toBe("image/jpeg");
    expect(tile.headers.get("cache-control")).toMatch(/immutable/);
    const etag = tile.headers.get("etag")!;
    const again = await fetch(`${inject("baseUrl")}${tilePath}`, { headers: { cookie: await cookieOf("viewer"), "if-none-match": etag } });
    expect(again.status).toBe(304);

    expect((await world.clients.outsider.get(`/api/micrographs/${res.body.id}/iiif/info.json`)).status).toBe(404);
    expect((await world.clients.outsider.get(tilePath)).status).toBe(404);
    expect((await world.clients.outsider.get(`/api/micrographs/${res.body.id}`)).status).toBe(404);
    for (const bad of [
      "..%2F..%2Fpgdata/512,512/0/default.jpg",
      "0,0,512,512/512,512/0/..%2F..%2Finfo.json",
      "0,0,512,512/512,512/90/default.jpg",
      "0,0,-1,512/512,512/0/default.jpg",
      "0,0,512,512/pct:50/0/default.jpg",
    ]) {
      const r = await world.clients.viewer.get<{ error: string }>(`/api/micrographs/${res.body.id}/iiif/${bad}`);
      expect([400, 404]).toContain(r.status);
    }
    expect((await world.clients.viewer.get(`/api/micrographs/${res.body.id}/iiif/512,512,512,488/512,488/0/default.jpg`)).status).toBe(200);
    expect((await world.clients.viewer.get(`/api/micrographs/${res.body.id}/iiif/5,0,512,512/512,512/0/default.jpg`)).status).toBe(404);

    expect((await world.clients.viewer.request("DELETE", `/api/micrographs/${res.body.id}`)).status).toBe(403);
    expect((await world.clients.analyst.request("DELETE", `/api/micrographs/${res.body.id}`)).status).toBe(204);
    expect(filesLeft()).toEqual([]);
    expect((await world.clients.analyst.get(`/api/micrographs/${res.body.id}`)).status).toBe(404);
  });

  it("calibrates the scale by two points and refuses a bad calibration", async () => {
    const res = await world.clients.analyst.upload<{ id: string; scaleUmPerPx: number | null }>(`/api/dies/${dieId}/micrographs`, uploadForm(png, "uncal.png"));
    expect(res.status).toBe(202);
    expect(res.body.scaleUmPerPx).toBeNull();
    const bad = await world.clients.analyst.request<{ error: string }>("PATCH", `/api/micrographs/${res.body.id}`, {
      calibration: { p1: [10, 10], p2: [10, 10], lengthUm: 50 },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/coincide/);
    const off = await world.clients.analyst.request<{ error: string }>("PATCH", `/api/micrographs/${res.body.id}`, {
      calibration: { p1: [0, 0], p2: [5000, 0], lengthUm: 50 },
    });
    expect(off.status).toBe(400);
    // 3-4-5: 500 px between the points over 100 µm → 0.2 µm/px (worked by hand).
    const ok = await world.clients.analyst.request<{ scaleUmPerPx: number; transform: number[][] }>("PATCH", `/api/micrographs/${res.body.id}`, {
      calibration: { p1: [100, 100], p2: [400, 500], lengthUm: 100 },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.scaleUmPerPx).toBeCloseTo(0.2, 12);
    expect((await world.clients.reviewer.request("PATCH", `/api/micrographs/${res.body.id}`, { label: "x" })).status).toBe(403);
    await waitForStatus(world.clients.analyst, res.body.id, "ready");
    expect((await world.clients.analyst.request("DELETE", `/api/micrographs/${res.body.id}`)).status).toBe(204);
    expect(filesLeft()).toEqual([]);
  });
});

async function cookieOf(who: "viewer") {
  // The client keeps its cookies private; a HEAD through it is enough to reuse them.
  return (world.clients[who] as unknown as { cookieHeader(): string }).cookieHeader();
}
