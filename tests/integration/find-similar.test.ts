import { beforeAll, describe, expect, it } from "vitest";
import sharp from "sharp";
import { demoWorld, EVERYONE, expectedStatus, freshCase, type Who } from "./fixtures";
import { NV24R_LAYOUT, padByLabel } from "@/lib/demo-die/layout";
import { applyAffine, invertAffine } from "@/lib/geometry/affine";
import type { AnyShape } from "@/lib/markup/types";
import type { DieEdgeDto, FindSimilarJobDto } from "@/lib/dto/find-similar";
import { padPairs, uploadDemoMicrograph, type UploadedDemo } from "../support/demo-micrographs";
import { uploadForm } from "../support/images";

// Find similar and die-edge proposals over HTTP on the demo die rendered at 3000 px wide
// (1 µm/px) into a fresh die of 2400 × 1600 µm: the renderer's placement (aligned here from the
// layout's pad centres) and the layout (lib/demo-die/layout.ts) are the ground truth.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let otherDieId: string;
let bright: UploadedDemo;
let markedPad: AnyShape;

const rect = (x0: number, y0: number, w: number, h: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [x0, y0],
      [x0 + w, y0],
      [x0 + w, y0 + h],
      [x0, y0 + h],
      [x0, y0],
    ],
  ],
});
const padShape = (label: string) => {
  const p = padByLabel(NV24R_LAYOUT, label);
  return {
    kind: "pad",
    geometry: rect(p.centreUm[0] - p.sizeUm[0] / 2, p.centreUm[1] - p.sizeUm[1] / 2, p.sizeUm[0], p.sizeUm[1]),
    properties: { label, state: p.state },
  };
};

async function newDie(caseId: string, name: string): Promise<string> {
  const d = await world.clients.owner.request<{ id: string }>("POST", `/api/cases/${caseId}/dies`, { name, widthUm: 2400, heightUm: 1600, notes: "" });
  expect(d.status).toBe(201);
  return d.body.id;
}

async function createShape(die: string, shape: unknown): Promise<AnyShape> {
  const res = await world.clients.analyst.request<AnyShape>("POST", `/api/dies/${die}/markup`, shape);
  expect(res.status).toBe(201);
  return res.body;
}

const search = (who: Who, body: unknown, micrographId = bright.id) =>
  world.clients[who].request<FindSimilarJobDto & { error?: string }>("POST", `/api/micrographs/${micrographId}/find-similar`, body);

/** Polls a search until it is done or failed. */
async function finished(jobId: string, micrographId = bright.id): Promise<FindSimilarJobDto> {
  const deadline = Date.now() + 120_000;
  for (;;) {
    const res = await world.clients.analyst.get<FindSimilarJobDto>(`/api/micrographs/${micrographId}/find-similar/${jobId}`);
    expect(res.status).toBe(200);
    if (res.body.status === "done" || res.body.status === "failed") return res.body;
    if (Date.now() > deadline) throw new Error(`search still ${res.body.status} (${res.body.progress} %)`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

const markupOf = async (die: string) => (await world.clients.owner.get<AnyShape[]>(`/api/dies/${die}/markup`)).body;

beforeAll(async () => {
  world = await demoWorld();
  const { caseId } = await freshCase(world.clients.owner, world.teamId, "Find similar target");
  dieId = await newDie(caseId, "NV-24R search die");
  otherDieId = await newDie(caseId, "another die");
  bright = await uploadDemoMicrograph(world.clients.analyst, dieId, "bright_field");
  // The reference placed on the die frame from the layout's pads, as the alignment suite does.
  const placed = await world.clients.analyst.request("PUT", `/api/micrographs/${bright.id}/alignment`, { model: "similarity", pairs: padPairs(bright.render) });
  expect(placed.status).toBe(200);
  markedPad = await createShape(dieId, padShape("VCC1"));
}, 180_000);

describe("finding pads like a marked one", () => {
  it("queues a search (202) and answers the other bonded pads, best first, centres within 2 µm of the layout", async () => {
    const res = await search("analyst", { shapeId: markedPad.id });
    expect(res.status).toBe(202);
    expect(res.headers.get("location")).toBe(`/api/micrographs/${bright.id}/find-similar/${res.body.jobId}`);
    expect(res.body).toMatchObject({ status: "queued", kind: "pad" });
    const done = await finished(res.body.jobId);
    expect(done.status).toBe("done");
    expect(done.progress).toBe(100);
    expect(done.searchedPx).toBeGreaterThan(0);
    expect(done.elapsedMs).toBeGreaterThanOrEqual(0);
    const candidates = done.candidates!;
    const scores = candidates.map((c) => c.score);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
    expect(Math.min(...scores)).toBeGreaterThanOrEqual(0.7);
    // Ground truth: the layout's bonded pads other than the marked VCC1 (a bonded pad carries a ball).
    const others = NV24R_LAYOUT.pads.filter((p) => p.state === "bonded" && p.label !== "VCC1");
    const near = (c: [number, number], p: [number, number]) => Math.hypot(c[0] - p[0], c[1] - p[1]) <= 2;
    const found = others.filter((p) => candidates.some((c) => near(c.centreUm, p.centreUm as [number, number])));
    expect(found.length / others.length).toBeGreaterThanOrEqual(0.95);
    // Never the template itself; every added pad would be as large as the one marked.
    expect(candidates.some((c) => near(c.centreUm, padByLabel(NV24R_LAYOUT, "VCC1").centreUm as [number, number]))).toBe(false);
    for (const c of candidates) {
      expect(c.boxUm.w).toBeCloseTo(80, 6);
      expect(c.boxUm.h).toBeCloseTo(80, 6);
      expect(c.boxUm.x + c.boxUm.w / 2).toBeCloseTo(c.centreUm[0], 6);
      expect([0, 90, 180, 270]).toContain(c.rotation);
    }
    // The pixel box and the die box describe the same place (renderer's placement, inverted).
    const toImage = invertAffine(bright.render.imageToDie);
    const best = candidates[0];
    const [ix, iy] = applyAffine(toImage, best.centreUm[0], best.centreUm[1]);
    expect(ix).toBeGreaterThanOrEqual(best.box.x - 1);
    expect(ix).toBeLessThanOrEqual(best.box.x + best.box.w + 1);
    expect(iy).toBeGreaterThanOrEqual(best.box.y - 1);
    expect(iy).toBeLessThanOrEqual(best.box.y + best.box.h + 1);
  });

  it("leaves out candidates on pads already marked, and searches from a pixel box", async () => {
    await createShape(dieId, padShape("VCC2"));
    const toImage = invertAffine(bright.render.imageToDie);
    const nc1 = padByLabel(NV24R_LAYOUT, "NC1");
    const [x0, y0] = applyAffine(toImage, nc1.centreUm[0] - 40, nc1.centreUm[1] + 40);
    const box = { x: Math.round(x0), y: Math.round(y0), w: 80, h: 80 };
    const fromBox = await search("analyst", { box, minScore: 0.5 });
    expect(fromBox.status).toBe(202);
    expect(fromBox.body.kind).toBe("pad");
    const boxDone = await finished(fromBox.body.jobId);
    expect(boxDone.status).toBe("done");
    const near = (c: [number, number], p: readonly [number, number]) => Math.hypot(c[0] - p[0], c[1] - p[1]) <= 2;
    expect(boxDone.candidates!.some((c) => near(c.centreUm, nc1.centreUm))).toBe(false);
    const fromShape = await finished((await search("analyst", { shapeId: markedPad.id })).body.jobId);
    const vcc2 = padByLabel(NV24R_LAYOUT, "VCC2").centreUm;
    expect(fromShape.candidates!.some((c) => near(c.centreUm, vcc2))).toBe(false);
    expect(fromShape.candidates!.some((c) => near(c.centreUm, padByLabel(NV24R_LAYOUT, "VCC1").centreUm))).toBe(false);
  });
});

describe("proposing the die edge", () => {
  it("answers four corners counter-clockwise from the lower-left, within 5 µm of the layout's outline", async () => {
    const res = await world.clients.analyst.request<DieEdgeDto>("POST", `/api/micrographs/${bright.id}/detect-die-edge`);
    expect(res.status).toBe(200);
    expect(res.body.cornersPx).toHaveLength(4);
    expect(res.body.confidence).toBeGreaterThan(0);
    expect(res.body.confidence).toBeLessThanOrEqual(1);
    const [w, h] = NV24R_LAYOUT.dieSizeUm;
    const truth = [
      [0, 0],
      [w, 0],
      [w, h],
      [0, h],
    ];
    res.body.cornersUm.forEach(([u, v], i) => expect(Math.hypot(u - truth[i][0], v - truth[i][1])).toBeLessThanOrEqual(5));
    // cornersUm is cornersPx through the stored transform (the renderer's ground truth).
    res.body.cornersPx.forEach(([x, y], i) => {
      const [u, v] = applyAffine(bright.render.imageToDie, x, y);
      expect(Math.hypot(u - res.body.cornersUm[i][0], v - res.body.cornersUm[i][1])).toBeLessThan(0.01);
    });
  });
});

describe("refusals", () => {
  it("refuses bad templates and options with 400 and a message, writing nothing", async () => {
    const before = await markupOf(dieId);
    const ruler = await createShape(dieId, {
      kind: "ruler",
      geometry: {
        type: "LineString",
        coordinates: [
          [100, 100],
          [300, 100],
        ],
      },
      properties: {},
    });
    const elsewhere = await createShape(otherDieId, padShape("G1"));
    const cases: [string, unknown, number, RegExp][] = [
      ["empty box", { box: { x: 100, y: 100, w: 0, h: 0 } }, 400, /at least 8 × 8 px/],
      ["one-pixel box", { box: { x: 100, y: 100, w: 1, h: 1 } }, 400, /at least 8 × 8 px/],
      ["box outside the image", { box: { x: bright.width - 10, y: 100, w: 40, h: 40 } }, 400, /outside the image/],
      ["negative box", { box: { x: -5, y: 100, w: 40, h: 40 } }, 400, /box\.x: must not be negative/],
      ["shape of another die", { shapeId: elsewhere.id }, 404, /That shape on this micrograph's die was not found/],
      ["shape that is not a pad or block", { shapeId: ruler.id }, 400, /starts from a pad or a block; that shape is a ruler/],
      ["minScore above 1", { shapeId: markedPad.id, minScore: 1.5 }, 400, /minScore: must be between 0 and 1/],
      ["minScore below 0", { shapeId: markedPad.id, minScore: -0.1 }, 400, /minScore: must be between 0 and 1/],
      ["rotation off the quarter turns", { shapeId: markedPad.id, rotations: [45] }, 400, /rotations/],
      ["no rotation", { shapeId: markedPad.id, rotations: [] }, 400, /rotations: must hold at least one/],
      ["repeated rotation", { shapeId: markedPad.id, rotations: [90, 90] }, 400, /rotations: must not repeat/],
      ["neither shape nor box", { minScore: 0.8 }, 400, /shapeId: give a shapeId or a box/],
      ["both shape and box", { shapeId: markedPad.id, box: { x: 0, y: 0, w: 40, h: 40 } }, 400, /give a shapeId or a box/],
      ["kind with a shape", { shapeId: markedPad.id, kind: "block" }, 400, /kind: comes from the shape/],
      ["unknown field", { shapeId: markedPad.id, colour: "red" }, 400, /Invalid body/],
      ["region outside the image", { shapeId: markedPad.id, region: { x: 0, y: 0, w: bright.width + 1, h: 100 } }, 400, /search region reaches outside/],
    ];
    for (const [what, body, status, message] of cases) {
      const res = await search("analyst", body);
      expect(res.status, what).toBe(status);
      expect(res.body.error, what).toMatch(message);
    }
    expect((await markupOf(dieId)).map((s) => s.id).sort()).toEqual([...before.map((s) => s.id), ruler.id].sort());
    const missing = await world.clients.analyst.get<{ error: string }>(`/api/micrographs/${bright.id}/find-similar/00000000-0000-4000-8000-000000000000`);
    expect(missing.status).toBe(404);
    expect(missing.body.error).toBe("That search was not found.");
  });

  it("refuses a micrograph not yet tiled with 409, for a search and an edge proposal", async () => {
    // 8000 × 6000 px with structure: its tiling takes seconds, so it is still queued or tiling right after the upload.
    const file = await sharp({ create: { width: 8000, height: 6000, channels: 3, background: { r: 90, g: 110, b: 80 } } })
      .composite([{ input: { create: { width: 300, height: 200, channels: 3, background: { r: 230, g: 210, b: 120 } } }, left: 1000, top: 900 }])
      .jpeg({ quality: 85 })
      .toBuffer();
    const up = await world.clients.analyst.upload<{ id: string; status: string }>(
      `/api/dies/${otherDieId}/micrographs`,
      uploadForm(file, "large.jpg", { illumination: "bright_field", label: "large", scaleUmPerPx: "0.5" }),
    );
    expect(up.status).toBe(202);
    const res = await search("analyst", { box: { x: 1000, y: 900, w: 300, h: 200 } }, up.body.id);
    const edge = await world.clients.analyst.request<{ error: string }>("POST", `/api/micrographs/${up.body.id}/detect-die-edge`);
    const now = (await world.clients.analyst.get<{ status: string }>(`/api/micrographs/${up.body.id}`)).body.status;
    expect(["queued", "tiling", "ready"]).toContain(now);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/not tiled yet \((queued|tiling), \d+ %\); search it once it is ready/);
    expect(edge.status).toBe(409);
  });

  it("lets owners and analysts search; reviewers and viewers get 403, outsiders 404, the signed-out 401", async () => {
    for (const who of EVERYONE) {
      const res = await search(who, { shapeId: markedPad.id, rotations: [0] });
      expect(res.status, who).toBe(expectedStatus(who, "edit", 202));
      const edge = await world.clients[who].request("POST", `/api/micrographs/${bright.id}/detect-die-edge`);
      expect(edge.status, who).toBe(expectedStatus(who, "edit", 200));
    }
    const job = (await search("owner", { shapeId: markedPad.id, rotations: [0], mirrored: false })).body.jobId;
    for (const who of EVERYONE) {
      const res = await world.clients[who].get(`/api/micrographs/${bright.id}/find-similar/${job}`);
      expect(res.status, who).toBe(expectedStatus(who, "edit", 200));
    }
    // A search asked for under another micrograph's path is not found there.
    const other = await world.clients.analyst.get(`/api/micrographs/00000000-0000-4000-8000-000000000000/find-similar/${job}`);
    expect(other.status).toBe(404);
    await finished(job);
  });
});
