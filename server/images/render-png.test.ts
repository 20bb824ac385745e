import { describe, expect, it, beforeAll } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { planRender, type RenderPlan } from "@/lib/export/render-plan";
import { renderAnnotatedPngBuffer, renderAnnotatedPngFile, type RenderInput } from "./render-png";
import { MARKUP_KINDS, type AnyShape } from "@/lib/markup/types";
import { markupStyle } from "@/lib/export/markup-svg";
import { REMARK_MARKER_SIZES, remarkMarkerShape } from "@/lib/markup/remark-marker";

// Pixel checks of the annotated PNG. Expected positions come from the affine maps written out
// by hand below (image px → die µm as PRODUCT.md's coordinates define it), and the image area
// is compared against sharp's own extract + resize of the same source rectangle.
const dir = mkdtempSync(path.join(os.tmpdir(), "kerfline-export-"));
const source = path.join(dir, "source.png");
const SRC_W = 1200;
const SRC_H = 900;
// 2 µm/px, y flipped, image px (0, 0) at die (0, 1800): die = [[2, 0, 0], [0, -2, 1800]] · px.
const transform = [
  [2, 0, 0],
  [0, -2, 1800],
] as const;
const die = { widthUm: 2400, heightUm: 1800 };
// The die rectangle itself (a whole-die export adds a margin around it).
const DIE_RECT = { x: 0, y: 0, width: 2400, height: 1800 };

beforeAll(async () => {
  // A smooth ramp (x → red, y → green) with no markup-like colours, so shapes are easy to find.
  const raw = Buffer.alloc(SRC_W * SRC_H * 3);
  for (let y = 0; y < SRC_H; y++)
    for (let x = 0; x < SRC_W; x++) {
      const i = (y * SRC_W + x) * 3;
      raw[i] = Math.round((x / SRC_W) * 120);
      raw[i + 1] = Math.round((y / SRC_H) * 120);
      raw[i + 2] = 60;
    }
  writeFileSync(
    source,
    await sharp(raw, { raw: { width: SRC_W, height: SRC_H, channels: 3 } })
      .png()
      .toBuffer(),
  );
});

const pad: AnyShape = {
  id: "11111111-1111-4111-8111-111111111111",
  kind: "pad",
  geometry: {
    type: "Polygon",
    coordinates: [
      [
        [800, 400],
        [1000, 400],
        [1000, 600],
        [800, 600],
        [800, 400],
      ],
    ],
  },
  properties: { label: "", net: "", state: "unbonded" },
  version: 1,
  createdBy: null,
  updatedAt: "2025-01-01T00:00:00.000Z",
};
const title = {
  caseTitle: "Case",
  dieName: "die",
  micrograph: "bright field",
  illumination: "Bright field",
  umPerPx: 1,
  date: "2025-01-02",
  author: "Ada",
  revision: "Revision 1 · draft, not signed off",
};

function plan(req: Parameters<typeof planRender>[2]): RenderPlan {
  const r = planRender({ width: SRC_W, height: SRC_H, transform }, die, req);
  if (!r.ok) throw new Error(r.message);
  return r.plan;
}
const input = (p: RenderPlan, shapes: AnyShape[] = [], caseTitle = "Case"): RenderInput => ({
  original: source,
  pixelCap: 1e9,
  plan: p,
  shapes,
  threads: [],
  labels: false,
  title: { ...title, caseTitle, umPerPx: p.umPerPx },
});

async function rawOf(png: Buffer) {
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data, info, at: (x: number, y: number) => [...data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3)] };
}

// The ramp never has red above blue by more than 60; the pad's amber stroke (#ffcf5a) does, even antialiased.
const isPadColour = ([r, , b]: number[]) => r - b > 80;

describe("renderAnnotatedPng", () => {
  it("draws a pad's outline on the pixels the die → output map predicts (±1 px)", async () => {
    // Region x 600–1600 µm, y 200–900 µm at 4 µm/px: output x = (xµm − 600) / 4, y = (900 − yµm) / 4.
    const p = plan({ region: { x: 600, y: 200, width: 1000, height: 700 }, umPerPx: 4 });
    expect([p.width, p.height]).toEqual([250, 175]);
    const { png } = await renderAnnotatedPngBuffer(input(p, [pad]));
    const img = await rawOf(png);
    const row = Math.round((900 - 500) / 4); // the pad's middle, y = 500 µm
    const hits = Array.from({ length: p.width }, (_, x) => x).filter((x) => isPadColour(img.at(x, row)));
    const leftRun = hits.filter((x) => x < 75);
    const rightRun = hits.filter((x) => x > 75);
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    expect(Math.abs(mean(leftRun) - (800 - 600) / 4)).toBeLessThanOrEqual(1);
    expect(Math.abs(mean(rightRun) - (1000 - 600) / 4)).toBeLessThanOrEqual(1);
    const topHits = Array.from({ length: p.height }, (_, y) => y).filter((y) => isPadColour(img.at(Math.round((900 - 600) / 4), y)));
    expect(Math.abs(mean(topHits.filter((y) => y < 100)) - (900 - 600) / 4)).toBeLessThanOrEqual(1);
  });

  it("draws a scale bar whose length in pixels is its label divided by the output scale (±1 px)", async () => {
    const p = plan({ widthPx: 800 });
    const { png, info } = await renderAnnotatedPngBuffer(input(p));
    const img = await rawOf(png);
    const y = info.scaleBar.y + 1;
    const white = Array.from({ length: info.width }, (_, x) => x).filter((x) => img.at(x, y).every((v) => v > 250));
    const [value, unit] = info.scaleBar.label.split(" ");
    const um = Number(value) * ({ nm: 1e-3, µm: 1, mm: 1000 } as Record<string, number>)[unit];
    expect(Math.abs(white.length - um / p.umPerPx)).toBeLessThanOrEqual(1);
    expect(info.scaleBar.label).toMatch(/^(1|2|5)0* (µm|mm)$/);
  });

  it("shows the same pixels as an independent extract and resize of the region", async () => {
    // Region x 400–2000 µm, y 600–1400 µm → image px x 200–1000, y (1800−1400)/2 = 200 to 600.
    const p = plan({ region: { x: 400, y: 600, width: 1600, height: 800 }, widthPx: 400 });
    const { png } = await renderAnnotatedPngBuffer(input(p));
    const ours = await rawOf(await sharp(png).extract({ left: 0, top: 0, width: 400, height: 200 }).png().toBuffer());
    const ref = await sharp(source).extract({ left: 200, top: 200, width: 800, height: 400 }).resize(400, 200).removeAlpha().raw().toBuffer();
    let diff = 0;
    for (let i = 0; i < ref.length; i++) diff += Math.abs(ref[i] - ours.data[i]);
    expect(diff / ref.length).toBeLessThan(1.5);
  });

  it("writes title, scale and software as PNG text chunks a PNG reader finds", async () => {
    const p = plan({ widthPx: 300 });
    const out = path.join(dir, "out.png");
    await renderAnnotatedPngFile(input(p, [], "Case µ-Ø"), out);
    // libvips' PNG loader reports tEXt chunks as comments (sharp metadata().comments).
    const meta = await sharp(out).metadata();
    const comments = Object.fromEntries((meta.comments ?? []).map((c) => [c.keyword, c.text]));
    expect(comments.Software).toBe("Kerfline");
    expect(comments.Title).toContain("die");
    expect(comments.Description).toContain(`${p.umPerPx} um/px`);
    expect(comments.Title).toContain("Case µ-Ø");
    expect(meta.width).toBe(300);
    expect(meta.channels).toBe(3);
  });
});

// A micrograph aligned at 30° to the die frame, 2 µm/px, y flipped (a reflection-rotation):
// die = T · px with T = [[2c, 2s, tx], [2s, −2c, ty]], c = cos 30°, s = sin 30°. Its linear part
// is 2 × a symmetric orthogonal matrix, so the inverse is written by hand: px = ½ · [[c, s], [s, −c]] · (die − t).
describe("renderAnnotatedPng of a rotated micrograph", () => {
  const c = Math.cos(Math.PI / 6);
  const s = Math.sin(Math.PI / 6);
  // Chosen so the image centre (600, 450) lands on the die centre (1200, 900).
  const tx = 1200 - (2 * c * 600 + 2 * s * 450);
  const ty = 900 - (2 * s * 600 - 2 * c * 450);
  const rotated = [
    [2 * c, 2 * s, tx],
    [2 * s, -2 * c, ty],
  ] as const;
  const toImage = (x: number, y: number): [number, number] => [0.5 * (c * (x - tx) + s * (y - ty)), 0.5 * (s * (x - tx) - c * (y - ty))];
  const marked = path.join(dir, "marked.png");

  beforeAll(async () => {
    // The same ramp, plus a white square over image px [300, 320) × [400, 420): centre (310, 410).
    const raw = Buffer.alloc(SRC_W * SRC_H * 3);
    for (let y = 0; y < SRC_H; y++)
      for (let x = 0; x < SRC_W; x++) {
        const i = (y * SRC_W + x) * 3;
        const white = x >= 300 && x < 320 && y >= 400 && y < 420;
        raw[i] = white ? 255 : Math.round((x / SRC_W) * 120);
        raw[i + 1] = white ? 255 : Math.round((y / SRC_H) * 120);
        raw[i + 2] = white ? 255 : 60;
      }
    writeFileSync(
      marked,
      await sharp(raw, { raw: { width: SRC_W, height: SRC_H, channels: 3 } })
        .png()
        .toBuffer(),
    );
  });

  function rotatedPlan(req: Parameters<typeof planRender>[2]): RenderPlan {
    const r = planRender({ width: SRC_W, height: SRC_H, transform: rotated }, die, req);
    if (!r.ok) throw new Error(r.message);
    return r.plan;
  }

  it("places a feature of the micrograph where its transform puts it in the die frame (±1 px)", async () => {
    // The die rectangle at 4 µm/px: output X = xµm / 4, Y = (1800 − yµm) / 4.
    const p = rotatedPlan({ region: DIE_RECT, umPerPx: 4 });
    expect(p.source?.kind).toBe("affine");
    const { png } = await renderAnnotatedPngBuffer({ ...input(p), original: marked });
    const img = await rawOf(png);
    let sx = 0;
    let sy = 0;
    let n = 0;
    for (let y = 0; y < p.height; y++)
      for (let x = 0; x < p.width; x++) {
        const [r, g, b] = img.at(x, y);
        if (r > 200 && g > 200 && b > 200) {
          sx += x + 0.5;
          sy += y + 0.5;
          n++;
        }
      }
    const dieX = 2 * c * 310 + 2 * s * 410 + tx;
    const dieY = 2 * s * 310 - 2 * c * 410 + ty;
    expect(n).toBeGreaterThan(10); // 40 × 40 µm → about 10 × 10 output px
    expect(Math.abs(sx / n - dieX / 4)).toBeLessThanOrEqual(1);
    expect(Math.abs(sy / n - (1800 - dieY) / 4)).toBeLessThanOrEqual(1);
  });

  it("samples the micrograph through the inverse transform: ramp values match, background outside", async () => {
    const p = rotatedPlan({ region: DIE_RECT, umPerPx: 4 });
    const { png } = await renderAnnotatedPngBuffer(input(p));
    const img = await rawOf(png);
    let inside = 0;
    let outside = 0;
    for (let y = 2; y < p.height; y += 7)
      for (let x = 2; x < p.width; x += 7) {
        const [ix, iy] = toImage(4 * (x + 0.5), 1800 - 4 * (y + 0.5));
        const margin = Math.min(ix, iy, SRC_W - ix, SRC_H - iy);
        const [r, g, b] = img.at(x, y);
        if (margin > 4) {
          // The ramp is linear, so resampling keeps it: red = 120·x/W, green = 120·y/H, blue 60.
          expect(Math.abs(r - (120 * ix) / SRC_W)).toBeLessThanOrEqual(3);
          expect(Math.abs(g - (120 * iy) / SRC_H)).toBeLessThanOrEqual(3);
          expect(Math.abs(b - 60)).toBeLessThanOrEqual(3);
          inside++;
        } else if (margin < -4) {
          expect([r, g, b]).toEqual([40, 44, 48]);
          outside++;
        }
      }
    expect(inside).toBeGreaterThan(200);
    expect(outside).toBeGreaterThan(100);
  });

  it("draws markup in the die frame, unaffected by the micrograph's rotation", async () => {
    const p = rotatedPlan({ region: { x: 600, y: 200, width: 1000, height: 700 }, umPerPx: 4 });
    const { png } = await renderAnnotatedPngBuffer(input(p, [pad]));
    const img = await rawOf(png);
    const row = Math.round((900 - 500) / 4);
    const hits = Array.from({ length: p.width }, (_, x) => x).filter((x) => isPadColour(img.at(x, row)));
    expect(Math.abs(Math.min(...hits) - (800 - 600) / 4)).toBeLessThanOrEqual(2);
    expect(Math.abs(Math.max(...hits) - (1000 - 600) / 4)).toBeLessThanOrEqual(2);
  });
});

describe("renderAnnotatedPngFile over several bands", () => {
  it("gives the same pixels as the single-pass render, threads and labels included", async () => {
    // 1200 px wide at 2 µm/px: 900 image rows + footer, two bands of 512 rows.
    const p = plan({ region: DIE_RECT, umPerPx: 2 });
    const labelled = { ...pad, properties: { ...pad.properties, label: "VDD" } } as AnyShape;
    const threads = [
      { at: [1200, 900] as const, open: true, number: 1 },
      { at: [1210, 505] as const, open: false, number: 2 },
    ];
    const full = { ...input(p, [labelled]), threads, labels: true };
    const out = path.join(dir, "banded.png");
    const info = await renderAnnotatedPngFile(full, out);
    expect(info.height).toBeGreaterThan(512);
    const { png } = await renderAnnotatedPngBuffer(full);
    const a = await sharp(out).raw().toBuffer();
    const b = await sharp(png).raw().toBuffer();
    expect(a.length).toBe(b.length);
    let diff = 0;
    for (let i = 0; i < a.length; i++) diff = Math.max(diff, Math.abs(a[i] - b[i]));
    expect(diff).toBe(0);
    // Remark markers (lib/markup/remark-marker.ts): a pixel just inside each body's top-left
    // corner, off its edge and its number, from the tail's tip at the anchor.
    const img = await rawOf(png);
    const shape = remarkMarkerShape(markupStyle(p.width).fontPx * REMARK_MARKER_SIZES.exportPerFontPx, 1);
    const [cornerX, cornerY] = shape.outline[4];
    const inBody = (tipX: number, tipY: number) => img.at(Math.round(tipX + cornerX + shape.edgePx + 1), Math.round(tipY + cornerY + shape.edgePx + 1));
    // The open one at die (1200, 900) → output (600, 450) is opaque copper #d27f42.
    const open = inBody(600, 450);
    [0xd2, 0x7f, 0x42].forEach((v, c) => expect(Math.abs(open[c] - v)).toBeLessThan(4));
    // The closed one's plate is rgba(13,15,17,0.72) over the micrograph's ramp (blue 60):
    // source-over gives 0.72 × 17 + 0.28 × 60 ≈ 29 in blue (SVG 1.1 §14.2, simple alpha compositing).
    const closed = inBody(1210 / 2, (1800 - 505) / 2);
    expect(Math.abs(closed[2] - (0.72 * 17 + 0.28 * 60))).toBeLessThan(6);
  });

  // The legend's order is MARKUP_KINDS (lib/markup/types.ts), whatever order the shapes come in.
  it("lists each kind present once in the legend, in MARKUP_KINDS order", async () => {
    const shape = (kind: AnyShape["kind"], geometry: AnyShape["geometry"]) =>
      ({ ...pad, id: crypto.randomUUID(), kind, geometry, properties: {} }) as unknown as AnyShape;
    const line = {
      type: "LineString",
      coordinates: [
        [100, 100],
        [300, 100],
      ],
    } as AnyShape["geometry"];
    const shapes = [shape("note", { type: "Point", coordinates: [50, 50] } as AnyShape["geometry"]), shape("ruler", line), pad, shape("trace", line), pad];
    const { info } = await renderAnnotatedPngBuffer(input(plan({ widthPx: 300 }), shapes));
    expect(info.kinds).toEqual(MARKUP_KINDS.filter((k) => ["note", "ruler", "pad", "trace"].includes(k)));
    expect(info.kinds).toEqual(["pad", "trace", "ruler", "note"]);
  });

  it("leaves no intermediate files behind, after success and after a failure", async () => {
    const { readdirSync, mkdirSync } = await import("node:fs");
    const sub = path.join(dir, "clean");
    mkdirSync(sub);
    await renderAnnotatedPngFile({ ...input(plan({ umPerPx: 2 })), threads: [] }, path.join(sub, "ok.png"));
    expect(readdirSync(sub)).toEqual(["ok.png"]);
    await expect(
      renderAnnotatedPngFile({ ...input(plan({ umPerPx: 2 })), original: path.join(dir, "missing.png") }, path.join(sub, "bad.png")),
    ).rejects.toThrow();
    expect(readdirSync(sub)).toEqual(["ok.png"]);
  });
});
