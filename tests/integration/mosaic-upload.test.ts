import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { cutMosaic, mosaicForm, type CutFrame } from "../support/mosaic-frames";
import { makeJpeg, makePng } from "../support/images";
import type { MicrographDto } from "@/lib/dto/micrographs";

// Mosaic uploads: the grid and every frame are checked like a single upload; a refusal names the
// frame and leaves nothing (no row, no object, no temporary file). The accepted upload is cut by
// the test from a synthetic image at offsets it chose, so recovered positions are checked against
// that ground truth.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let frames: CutFrame[];
let otherSize: Buffer;
let png: Buffer;
const dataDir = () => inject("dataDir");
const GRID = { rows: "2", cols: "2", order: "rows", overlapPercent: "25", scaleUmPerPx: "0.2", illumination: "bright_field" };

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Mosaic target"));
  frames = await cutMosaic({ rows: 2, cols: 2, frameWidth: 320, frameHeight: 240, overlap: 0.25, jitter: 6 });
  otherSize = await makeJpeg(300, 240);
  png = await makePng(320, 240);
});

/** Every object of the die and every upload part in scratch (nothing may remain after a refusal). */
function filesLeft(): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    if (!fs.existsSync(d)) return;
    for (const e of fs.readdirSync(d, { withFileTypes: true })) {
      const p = path.join(d, e.name);
      if (e.isDirectory()) walk(p);
      else out.push(path.relative(dataDir(), p));
    }
  };
  for (const area of ["originals", "tiles", "mosaics"]) walk(path.join(dataDir(), area, dieId));
  walk(path.join(dataDir(), "scratch", "incoming"));
  return out;
}

const count = async () => (await world.clients.owner.get<unknown[]>(`/api/dies/${dieId}/micrographs`)).body.length;
const post = (form: FormData, who: keyof typeof world.clients = "analyst") =>
  world.clients[who].upload<{ id: string; status: string; error: string }>(`/api/dies/${dieId}/mosaics`, form);

type Bad = { name: string; form: () => FormData; message: RegExp };
const replace = (i: number, bytes: () => Buffer, name?: string) => () => frames.map((f) => (f.index === i ? { bytes: bytes(), name: name ?? f.name } : f));
const BAD: Bad[] = [
  { name: "three frames for a 2 × 2 grid", form: () => mosaicForm(GRID, frames.slice(0, 3)), message: /2 × 2 mosaic needs 4 frames.*3 arrived/ },
  { name: "five frames for a 2 × 2 grid", form: () => mosaicForm(GRID, [...frames, frames[0]]), message: /needs 4 frames.*5 arrived/ },
  {
    name: "a frame of another size",
    form: () => mosaicForm(GRID, replace(2, () => otherSize)()),
    message: /Frame 3 \(IMG_0003\.jpg\): it is 300 × 240 px, but frame 1 is 320 × 240/,
  },
  {
    name: "a frame of another format",
    form: () => mosaicForm(GRID, replace(1, () => png, "IMG_0002.png")()),
    message: /Frame 2 \(IMG_0002\.png\): .*same format/,
  },
  { name: "an overlap under 5 %", form: () => mosaicForm({ ...GRID, overlapPercent: "4" }, frames), message: /overlapPercent must be between 5 and 60/ },
  { name: "an overlap over 60 %", form: () => mosaicForm({ ...GRID, overlapPercent: "61" }, frames), message: /overlapPercent must be between 5 and 60/ },
  { name: "an unknown capture order", form: () => mosaicForm({ ...GRID, order: "zigzag" }, frames), message: /order must be rows or serpentine/ },
  { name: "zero rows", form: () => mosaicForm({ ...GRID, rows: "0" }, frames), message: /rows must be at least 1/ },
  { name: "a grid of one frame", form: () => mosaicForm({ ...GRID, rows: "1", cols: "1" }, frames.slice(0, 1)), message: /at least two frames/ },
  {
    name: "a truncated frame",
    form: () => mosaicForm(GRID, replace(3, () => frames[3].bytes.subarray(0, frames[3].bytes.length >> 1))()),
    message: /Frame 4 \(IMG_0004\.jpg\): .*incomplete/,
  },
  {
    name: "a text file as a frame",
    form: () => mosaicForm(GRID, replace(1, () => Buffer.from("not an image at all, just notes\n".repeat(3)))()),
    message: /Frame 2 \(IMG_0002\.jpg\): Only JPEG, PNG, TIFF/,
  },
  { name: "an empty frame", form: () => mosaicForm(GRID, replace(0, () => Buffer.alloc(0))()), message: /Frame 1 \(IMG_0001\.jpg\): the file is empty/ },
  { name: "a frame name with folders", form: () => mosaicForm(GRID, replace(2, () => frames[2].bytes, "../IMG_0003.jpg")()), message: /Frame 3 .*plain name/ },
  { name: "a bad capture field", form: () => mosaicForm({ ...GRID, illumination: "uv" }, frames), message: /illumination must be one of/ },
];

describe("POST /api/dies/{dieId}/mosaics refuses bad input", () => {
  for (const c of BAD) {
    it(`answers 400 for ${c.name}, naming the problem, and keeps nothing`, async () => {
      const before = await count();
      const res = await post(c.form());
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(c.message);
      expect(await count()).toBe(before);
      expect(filesLeft()).toEqual([]);
    });
  }

  it("answers 404 for another team's die, 403 for a reviewer or viewer, 401 signed out, and keeps nothing", async () => {
    for (const [who, status] of [
      ["outsider", 404],
      ["reviewer", 403],
      ["viewer", 403],
      ["anonymous", 401],
    ] as const) {
      const res = await post(mosaicForm(GRID, frames), who);
      expect(res.status).toBe(status);
      expect(typeof res.body.error).toBe("string");
    }
    expect(await count()).toBe(0);
    expect(filesLeft()).toEqual([]);
  });
});

async function waitForStage(id: string, done: (m: MicrographDto) => boolean, timeoutMs = 120_000): Promise<{ last: MicrographDto; seen: string[] }> {
  const deadline = Date.now() + timeoutMs;
  const seen: string[] = [];
  for (;;) {
    const m = (await world.clients.analyst.get<MicrographDto>(`/api/micrographs/${id}`)).body;
    const stage = m.mosaic?.stage ?? "none";
    if (seen.at(-1) !== stage) seen.push(stage);
    if (done(m)) return { last: m, seen };
    if (m.status === "failed") throw new Error(`mosaic failed: ${m.error}`);
    if (Date.now() > deadline) throw new Error(`mosaic still at ${stage} (${m.status}); seen ${seen.join(", ")}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe("an accepted 2 × 2 mosaic", () => {
  let id: string;

  it("answers 202 with the id of the micrograph it becomes, stitches, tiles and describes the grid", async () => {
    const res = await post(mosaicForm(GRID, frames));
    expect(res.status).toBe(202);
    expect(Object.keys(res.body).sort()).toEqual(["id", "status"]);
    expect(res.body.status).toBe("queued");
    id = res.body.id;
    const { last, seen } = await waitForStage(id, (m) => m.status === "ready" && m.mosaic?.stage === "done");
    expect(seen.at(-1)).toBe("done");
    const mosaic = last.mosaic!;
    expect(mosaic).toMatchObject({ rows: 2, cols: 2, order: "rows", frameWidth: 320, frameHeight: 240, overlapPercent: 25, flatField: true });
    expect(mosaic.frames.map((f) => [f.index, f.row, f.col])).toEqual([
      [0, 0, 0],
      [1, 0, 1],
      [2, 1, 0],
      [3, 1, 1],
    ]);
    // Four neighbour pairs in a 2 × 2 grid: two across, two down.
    expect(mosaic.pairs.map((p) => [p.a, p.b].sort().join("-")).sort()).toEqual(["0-1", "0-2", "1-3", "2-3"]);
    for (const p of mosaic.pairs) expect(["measured", "stage_model"]).toContain(p.used);
    expect(mosaic.residualPx).toEqual({ rms: expect.any(Number), max: expect.any(Number) });
    // Ground truth: the cut offsets, relative to frame 0 (the stitched result puts frame 0's
    // corner where the union's top-left lands, so compare differences).
    const f0 = mosaic.frames[0];
    for (const f of mosaic.frames) {
      const truth = frames[f.index];
      expect(Math.abs(f.x - f0.x - (truth.x - frames[0].x))).toBeLessThanOrEqual(1);
      expect(Math.abs(f.y - f0.y - (truth.y - frames[0].y))).toBeLessThanOrEqual(1);
    }
    expect(last.width).toBeGreaterThanOrEqual(320);
    const info = await world.clients.viewer.get<{ width: number; height: number }>(`/api/micrographs/${id}/iiif/info.json`);
    expect(info.status).toBe(200);
    expect([info.body.width, info.body.height]).toEqual([last.width, last.height]);
    // An ordinary micrograph has no mosaic.
    const list = (await world.clients.viewer.get<MicrographDto[]>(`/api/dies/${dieId}/micrographs`)).body;
    expect(list.find((m) => m.id === id)?.mosaic?.rows).toBe(2);
  });

  it("stitches again with another overlap, serving the previous result until the new one is stored", async () => {
    const before = (await world.clients.analyst.get<MicrographDto>(`/api/micrographs/${id}`)).body;
    expect((await world.clients.reviewer.request("POST", `/api/micrographs/${id}/mosaic/restitch`, { overlapPercent: 20 })).status).toBe(403);
    expect((await world.clients.analyst.request("POST", `/api/micrographs/${id}/mosaic/restitch`, { overlapPercent: 70 })).status).toBe(400);
    expect((await world.clients.analyst.request("POST", `/api/micrographs/${id}/mosaic/restitch`, {})).status).toBe(400);
    const res = await world.clients.analyst.request<MicrographDto>("POST", `/api/micrographs/${id}/mosaic/restitch`, { overlapPercent: 22 });
    expect(res.status).toBe(202);
    expect(res.body.status).toBe("ready");
    expect(res.body.mosaic?.restitching).toBe(true);
    // A second request while one runs is refused.
    expect((await world.clients.analyst.request("POST", `/api/micrographs/${id}/mosaic/restitch`, { overlapPercent: 30 })).status).toBe(409);
    const served: number[] = [];
    const { last } = await waitForStage(id, (m) => {
      served.push(m.status === "ready" ? 1 : 0);
      return m.mosaic?.restitching === false;
    });
    // Ready throughout: the old pyramid was served until the new one replaced it.
    expect(served.every((s) => s === 1)).toBe(true);
    expect(last.mosaic).toMatchObject({ overlapPercent: 22, stage: "done", restitching: false });
    expect((await world.clients.viewer.get(`/api/micrographs/${id}/iiif/info.json`)).status).toBe(200);
    expect(last.updatedAt >= before.updatedAt).toBe(true);
    // Markup stays on the same features: frame 0's corner maps to the same die point as before
    // (a consistency check of the transform update, against the previous placement).
    const die = (m: MicrographDto) => {
      const [[a, b, tx], [c, d, ty]] = m.transform!;
      const f = m.mosaic!.frames[0];
      return [a * f.x + b * f.y + tx, c * f.x + d * f.y + ty];
    };
    expect(die(last)[0]).toBeCloseTo(die(before)[0], 9);
    expect(die(last)[1]).toBeCloseTo(die(before)[1], 9);
  });

  it("removes the frames with the micrograph", async () => {
    const framesDir = path.join(dataDir(), "mosaics", dieId, id);
    expect(fs.readdirSync(framesDir).sort()).toEqual(["0.jpg", "1.jpg", "2.jpg", "3.jpg"]);
    expect((await world.clients.analyst.request("DELETE", `/api/micrographs/${id}`)).status).toBe(204);
    expect(fs.existsSync(framesDir)).toBe(false);
    expect(filesLeft()).toEqual([]);
  });
});
