import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seededRandom } from "@/lib/alignment/test-support";
import type { MosaicLayout } from "@/lib/mosaic/types";
import { stitchMosaic } from "./stitch";
import { cutMosaic } from "@/tests/support/mosaic-frames";
import { cutFrames, dieLikeScene, sceneSizeFor, type GridSpec, type Rect, type Scene } from "./test-support";

// Ground truth made here: frames cut from a synthetic die-like scene at known positions
// (jittered up to ±3 % of a frame), each with its own brightness, vignetting and sensor noise
// (test-support.ts). The stitcher never sees the positions; the checks compare its placement
// and its output pixels with the scene. Methods under test: phase correlation (Kuglin &
// Hines 1975), NCC alias choice and stage model (Chalfoun et al., Sci. Rep. 7:4988, 2017),
// weighted least-squares placement (Preibisch, Saalfeld & Tomancak, Bioinformatics 25(11), 2009).

let dir: string;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-mosaic-"));
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const BASE = { frameWidth: 320, frameHeight: 256, overlapPercent: 20, jitter: 0.03, origin: { x: 16, y: 16 }, vignetting: 0.2, noise: 3 };

async function stitchGrid(name: string, spec: GridSpec, blank?: Rect) {
  const size = sceneSizeFor(spec);
  const scene = await dieLikeScene(size.width, size.height, spec.seed + 100, blank);
  const folder = path.join(dir, name);
  fs.mkdirSync(folder);
  const { framePaths, truth } = await cutFrames(scene, spec, folder);
  const outPath = path.join(folder, "mosaic.tif");
  const stages: string[] = [];
  const layout = await stitchMosaic({
    framePaths,
    rows: spec.rows,
    cols: spec.cols,
    order: spec.order,
    overlapPercent: spec.overlapPercent,
    flatField: true,
    outPath,
    workDir: folder,
    onProgress: (stage) => {
      if (stages.at(-1) !== stage) stages.push(stage);
    },
  });
  return { scene, truth, layout, outPath, stages, folder };
}

/** Placement errors after removing the global offset of frame 0. */
function positionErrors(layout: MosaicLayout, truth: { x: number; y: number }[]): number[] {
  const f0 = layout.frames.find((f) => f.index === 0)!;
  return layout.frames.map((f) => Math.hypot(f.x - f0.x - (truth[f.index].x - truth[0].x), f.y - f0.y - (truth[f.index].y - truth[0].y)));
}

const rms = (xs: number[]) => Math.sqrt(xs.reduce((s, x) => s + x * x, 0) / xs.length);

function greyOf(rgb: Buffer | Uint8Array, channels: number): Float32Array {
  const out = new Float32Array(rgb.length / channels);
  for (let i = 0; i < out.length; i++) out[i] = channels === 1 ? rgb[i] : (rgb[i * channels] + rgb[i * channels + 1] + rgb[i * channels + 2]) / 3;
  return out;
}

function ncc(a: Float32Array, aw: number, ax: number, ay: number, b: Float32Array, bw: number, bx: number, by: number, size: number): number {
  let sa = 0;
  let sb = 0;
  let saa = 0;
  let sbb = 0;
  let sab = 0;
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const p = a[(ay + y) * aw + ax + x];
      const q = b[(by + y) * bw + bx + x];
      sa += p;
      sb += q;
      saa += p * p;
      sbb += q * q;
      sab += p * q;
    }
  }
  const n = size * size;
  return (sab - (sa * sb) / n) / Math.sqrt((saa - (sa * sa) / n) * (sbb - (sb * sb) / n));
}

function spread(img: Float32Array, width: number, x0: number, y0: number, size: number): number {
  let s = 0;
  let ss = 0;
  for (let y = y0; y < y0 + size; y++) {
    for (let x = x0; x < x0 + size; x++) {
      s += img[y * width + x];
      ss += img[y * width + x] ** 2;
    }
  }
  const n = size * size;
  return Math.sqrt(Math.max(0, ss / n - (s / n) ** 2));
}

/**
 * Samples patches of the stitched output inside frames and finds each one in the scene by an
 * NCC search ±3 px around where the ground truth says it came from; returns the offsets found.
 */
async function patchOffsets(scene: Scene, truth: { x: number; y: number }[], layout: MosaicLayout, outPath: string, seed: number) {
  const { data, info } = await sharp(outPath).raw().toBuffer({ resolveWithObject: true });
  const mosaic = greyOf(data, info.channels);
  const source = greyOf(scene.rgb, 3);
  const f0 = layout.frames.find((f) => f.index === 0)!;
  const shift = { x: truth[0].x - f0.x, y: truth[0].y - f0.y };
  const rnd = seededRandom(seed);
  const size = 24;
  const found: { dx: number; dy: number; score: number }[] = [];
  for (let k = 0; found.length < 16 && k < 400; k++) {
    const f = layout.frames[Math.floor(rnd() * layout.frames.length)];
    const mx = f.x + 8 + Math.floor(rnd() * (layout.frameWidth - size - 16));
    const my = f.y + 8 + Math.floor(rnd() * (layout.frameHeight - size - 16));
    // Only patches with structure to match (a flat block's NCC is its noise).
    if (spread(mosaic, info.width, mx, my, size) < 20) continue;
    let best = { dx: 0, dy: 0, score: -2 };
    for (let dy = -3; dy <= 3; dy++) {
      for (let dx = -3; dx <= 3; dx++) {
        const sx = mx + shift.x + dx;
        const sy = my + shift.y + dy;
        if (sx < 0 || sy < 0 || sx + size > scene.width || sy + size > scene.height) continue;
        const score = ncc(mosaic, info.width, mx, my, source, scene.width, sx, sy, size);
        if (score > best.score) best = { dx, dy, score };
      }
    }
    found.push(best);
  }
  return found;
}

describe("stitchMosaic against a ground truth it did not see", () => {
  const grids: [string, GridSpec][] = [
    ["2×2", { ...BASE, rows: 2, cols: 2, order: "rows", seed: 1 }],
    ["3×4", { ...BASE, rows: 3, cols: 4, order: "rows", seed: 2 }],
    ["1×6", { ...BASE, rows: 1, cols: 6, order: "rows", seed: 3 }],
    ["3×4 serpentine", { ...BASE, rows: 3, cols: 4, order: "serpentine", seed: 4 }],
  ];
  for (const [name, spec] of grids) {
    it(`places the frames of a ${name} grid within 0.5 px RMS and 1 px max, and its pixels match the scene within 1 px`, async () => {
      const { scene, truth, layout, outPath, stages } = await stitchGrid(name.replace(/\W+/g, "-"), spec);
      const errors = positionErrors(layout, truth);
      console.info(`${name}: position error rms ${rms(errors).toFixed(3)} px, max ${Math.max(...errors).toFixed(3)} px; fit residual`, layout.residualPx);
      expect(rms(errors)).toBeLessThanOrEqual(0.5);
      expect(Math.max(...errors)).toBeLessThanOrEqual(1);
      expect(layout.warnings).toEqual([]);
      expect(layout.pairs).toHaveLength(spec.rows * (spec.cols - 1) + (spec.rows - 1) * spec.cols);
      expect(layout.pairs.every((p) => p.used === "measured")).toBe(true);
      expect(stages).toEqual(["registering", "placing", "composing"]);
      const meta = await sharp(outPath).metadata();
      expect([meta.width, meta.height]).toEqual([layout.width, layout.height]);
      const patches = await patchOffsets(scene, truth, layout, outPath, spec.seed);
      expect(patches).toHaveLength(16);
      for (const p of patches) {
        expect(Math.hypot(p.dx, p.dy)).toBeLessThanOrEqual(1);
        expect(p.score).toBeGreaterThan(0.8);
      }
    });
  }

  it("lists the frames with their grid cells in capture order, serpentine rows right to left", async () => {
    const { layout } = await stitchGrid("cells", { ...BASE, rows: 2, cols: 3, order: "serpentine", seed: 5 });
    expect(layout.frames.map((f) => [f.index, f.row, f.col])).toEqual([
      [0, 0, 0],
      [1, 0, 1],
      [2, 0, 2],
      [3, 1, 2],
      [4, 1, 1],
      [5, 1, 0],
    ]);
    // Pairs name neighbours by capture index: frame 3 is below frame 2.
    expect(layout.pairs.find((p) => p.a === 2 && p.b === 3)?.dy).toBeGreaterThan(150);
  });

  it("places a pair with a blank, featureless overlap by the stage model, with a warning, within 2 px", async () => {
    const spec: GridSpec = { ...BASE, rows: 2, cols: 3, order: "rows", seed: 6, jitter: 0.02 };
    const step = Math.round(spec.frameWidth * (1 - spec.overlapPercent / 100));
    // Blank over the whole overlap of frames 0 and 1 (with room for the jitter); the frames'
    // other overlaps keep enough texture to place frame 1.
    const blank = { x: spec.origin.x + step - 12, y: 0, width: spec.frameWidth - step + 24, height: spec.origin.y + spec.frameHeight + 12 };
    const { truth, layout } = await stitchGrid("blank", spec, blank);
    const pair = layout.pairs.find((p) => p.a === 0 && p.b === 1)!;
    expect(pair.used).toBe("stage_model");
    expect(layout.warnings).toHaveLength(1);
    expect(layout.warnings[0]).toMatch(/^Frames 1 and 2: /);
    expect(layout.pairs.filter((p) => p.used === "stage_model")).toHaveLength(1);
    const worst = Math.max(...positionErrors(layout, truth));
    console.info(`blank overlap: pair peak ${pair.peak}, worst frame error ${worst.toFixed(3)} px`);
    expect(worst).toBeLessThanOrEqual(2);
  });

  it("flags a noise-free blank overlap as weak with the flat field on (shading slope is not structure)", async () => {
    // The browser test's case: JPEG frames of a flat grey area (no sensor noise), where the
    // shading gain leaves only a smooth slope in the overlap that once matched at any shift.
    const blank = { x: 290, y: 0, width: 130, height: 330 };
    const frames = await cutMosaic({ rows: 3, cols: 3, frameWidth: 400, frameHeight: 300, overlap: 0.25, jitter: 6, order: "serpentine", seed: 11, blank });
    const folder = path.join(dir, "blank-jpeg");
    fs.mkdirSync(folder);
    const framePaths = frames.map((f) => {
      const p = path.join(folder, f.name);
      fs.writeFileSync(p, f.bytes);
      return p;
    });
    const layout = await stitchMosaic({
      framePaths,
      rows: 3,
      cols: 3,
      order: "serpentine",
      overlapPercent: 25,
      flatField: true,
      outPath: path.join(folder, "mosaic.tif"),
      workDir: folder,
      onProgress: () => {},
    });
    expect(layout.pairs.filter((p) => p.used === "stage_model").map((p) => `${p.a}-${p.b}`)).toEqual(["0-1"]);
    // The cut frames carry their true positions.
    const worst = Math.max(...positionErrors(layout, frames));
    expect(worst).toBeLessThanOrEqual(2);
  });
});

describe("composition memory", () => {
  it("grows the process's RSS by far less than the mosaic's size while composing", async () => {
    const spec: GridSpec = {
      ...BASE,
      frameWidth: 1024,
      frameHeight: 768,
      overlapPercent: 10,
      jitter: 0.01,
      rows: 10,
      cols: 3,
      order: "rows",
      seed: 8,
      format: "jpeg",
    };
    const size = sceneSizeFor(spec);
    const scene = await dieLikeScene(size.width, size.height, 108);
    const folder = path.join(dir, "memory");
    fs.mkdirSync(folder);
    const { framePaths } = await cutFrames(scene, spec, folder);
    let base = 0;
    let peak = 0;
    const layout = await stitchMosaic({
      framePaths,
      rows: spec.rows,
      cols: spec.cols,
      order: spec.order,
      overlapPercent: spec.overlapPercent,
      flatField: true,
      outPath: path.join(folder, "mosaic.tif"),
      workDir: folder,
      onProgress: (stage, percent) => {
        if (stage !== "composing") return;
        const rss = process.memoryUsage.rss();
        if (percent === 0) base = rss;
        peak = Math.max(peak, rss);
      },
    });
    const canvas = layout.width * layout.height * 3;
    console.info(
      `composing ${layout.width}×${layout.height} (${(canvas / 2 ** 20).toFixed(0)} MB of pixels): RSS grew ${((peak - base) / 2 ** 20).toFixed(1)} MB`,
    );
    expect(base).toBeGreaterThan(0);
    expect(peak - base).toBeLessThan(canvas / 4);
  });
});
