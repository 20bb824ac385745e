import { mkdtemp, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { applyAffine, invertAffine } from "@/lib/geometry/affine";
import type { Affine2x3, Position } from "@/lib/geometry/types";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import type { DieSide, Pad } from "@/lib/demo-die/layout-types";
import { demoMicrographOptions, renderDemoMicrograph, type DemoRender } from "./demo-die";
import { PALETTE } from "@/lib/demo-die/render-svg";

type Raster = { data: Buffer; width: number; height: number; channels: number };

let dir: string;
let bright: { render: DemoRender; raster: Raster };
let dark: { render: DemoRender; raster: Raster };

async function renderAndRead(look: "bright_field" | "dark_field") {
  const file = path.join(dir, `${look}.jpg`);
  const render = await renderDemoMicrograph(file, demoMicrographOptions(look, 1200));
  const { data, info } = await sharp(file, { limitInputPixels: 1200 * 1000 })
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { render, raster: { data, width: info.width, height: info.height, channels: info.channels } };
}

beforeAll(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), "kerfline-demo-die-"));
  bright = await renderAndRead("bright_field");
  dark = await renderAndRead("dark_field");
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

/** The RGB of the pixel containing die point p, found through the inverse of imageToDie. */
function rgbAt(r: { render: DemoRender; raster: Raster }, [x, y]: Position): [number, number, number] {
  const dieToImage: Affine2x3 = invertAffine(r.render.imageToDie);
  const [u, v] = applyAffine(dieToImage, x, y);
  const i = (Math.floor(v) * r.raster.width + Math.floor(u)) * r.raster.channels;
  return [r.raster.data[i], r.raster.data[i + 1], r.raster.data[i + 2]];
}

const hex = (h: string): [number, number, number] => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16)) as [number, number, number];
const dist = (a: number[], b: number[]) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
// ITU-R BT.601 luma weights.
const luma = ([r, g, b]: number[]) => 0.299 * r + 0.587 * g + 0.114 * b;

/** The name of the bright-field palette colour nearest to a sampled pixel. */
function nearestColour(rgb: number[]): string {
  const entries = Object.entries(PALETTE.bright_field);
  return entries.reduce((best, [name, h]) => (dist(rgb, hex(h)) < dist(rgb, hex(best[1])) ? [name, h] : best), entries[0])[0];
}

describe("demo micrographs", () => {
  it("reports the size and scale asked for", () => {
    // By hand: 1200 px over 2400 + 2·300 µm is 2.5 µm/px; 2200 µm tall gives 880 px. The dark
    // field is enlarged 2 %, so its scale is 2.5 / 1.02 µm/px.
    expect([bright.raster.width, bright.raster.height]).toEqual([1200, 880]);
    expect(bright.render.umPerPx).toBeCloseTo(2.5, 12);
    expect(dark.render.umPerPx).toBeCloseTo(2.5 / 1.02, 12);
  });

  it("finds the die edge in the bright-field raster where the transform puts it", () => {
    // Measured on the picture: first non-background pixel along die y = 875 µm (a row free of
    // wires); the transform says die x = 0 is at u = 120 px.
    const [, v] = applyAffine(invertAffine(bright.render.imageToDie), 0, 875);
    const row = Math.floor(v);
    const background = hex(PALETTE.bright_field.background);
    let u = 0;
    while (dist(Array.from(bright.raster.data.subarray((row * 1200 + u) * 3, (row * 1200 + u) * 3 + 3)), background) < 30) u += 1;
    expect(Math.abs(u - 120)).toBeLessThanOrEqual(1);
  });

  it("shows metal at every pad centre and substrate between neighbouring pads (bright field)", () => {
    const metal = new Set(["metal", "padOpening", "gold"]);
    for (const pad of NV24R_LAYOUT.pads) {
      expect(metal.has(nearestColour(rgbAt(bright, pad.centreUm))), pad.label).toBe(true);
    }
    const bySide = new Map<DieSide, Pad[]>();
    for (const p of NV24R_LAYOUT.pads) bySide.set(p.side, [...(bySide.get(p.side) ?? []), p]);
    for (const [side, pads] of bySide) {
      const along = side === "left" || side === "right" ? 1 : 0;
      const sorted = [...pads].sort((a, b) => a.centreUm[along] - b.centreUm[along]);
      for (let i = 1; i < sorted.length; i += 1) {
        const mid: Position = [(sorted[i - 1].centreUm[0] + sorted[i].centreUm[0]) / 2, (sorted[i - 1].centreUm[1] + sorted[i].centreUm[1]) / 2];
        expect(nearestColour(rgbAt(bright, mid)), `${sorted[i - 1].label}–${sorted[i].label}`).toBe("substrate");
      }
    }
  });

  it("maps each pad centre inside that pad's bright outline (dark field, turned and scaled)", () => {
    const inward: Record<DieSide, Position> = { left: [1, 0], right: [-1, 0], top: [0, -1], bottom: [0, 1] };
    for (const pad of NV24R_LAYOUT.pads) {
      const [cx, cy] = pad.centreUm;
      expect(luma(rgbAt(dark, pad.centreUm)), `${pad.label} centre`).toBeLessThan(60);
      const [ix, iy] = inward[pad.side];
      // Inward and both directions along the edge; outward the wire may cover the outline.
      for (const [dx, dy] of [
        [ix, iy],
        [iy, ix],
        [-iy, -ix],
      ]) {
        let brightest = 0;
        // The pad outline is at 40 µm from the centre, the opening's at 34 µm.
        for (let d = 32; d <= 46; d += 0.5) brightest = Math.max(brightest, luma(rgbAt(dark, [cx + d * dx, cy + d * dy])));
        expect(brightest, `${pad.label} towards ${dx},${dy}`).toBeGreaterThan(140);
      }
    }
  });
});
