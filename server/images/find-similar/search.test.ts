import { describe, expect, it } from "vitest";
import { graySource } from "@/lib/find-similar/raster";
import type { Gray, Rotation } from "@/lib/find-similar/types";
import { findSimilar } from "./search";

/**
 * A constructed test image: an asymmetric cell (no rotation or mirror maps it onto itself)
 * placed turned, mirrored, brighter or darker and under noise, plus decoys that lack one detail.
 * The placements are drawn here by sampling the cell through explicit rotation matrices, so the
 * ground truth (centre, turn, mirror) is what this test wrote, not what the search code computes.
 */

const CW = 48;
const CH = 32;
/** The cell in its own px (0…48 × 0…32): two bars, a disc and a small square on a dark ground. */
function cell(x: number, y: number, withDisc: boolean): number {
  if (x < 0 || y < 0 || x >= CW || y >= CH) return -1; // outside
  if (y >= 4 && y < 10 && x >= 4 && x < 44) return 200;
  if (x >= 4 && x < 10 && y >= 4 && y < 28) return 200;
  if (withDisc && (x - 36) ** 2 + (y - 22) ** 2 < 25) return 170;
  if (x >= 20 && x < 26 && y >= 18 && y < 24) return 130;
  return 70;
}

type Placement = { cx: number; cy: number; rotation: Rotation; mirrored: boolean; gain: number; offset: number; decoy?: boolean };

function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function draw(w: number, h: number, placements: Placement[], noise: number): Gray {
  const data = new Float32Array(w * h).fill(40);
  for (const p of placements) {
    const th = (p.rotation * Math.PI) / 180;
    const [c, s] = [Math.round(Math.cos(th)), Math.round(Math.sin(th))];
    const half = Math.max(CW, CH) / 2 + 2;
    for (let py = Math.floor(p.cy - half); py < p.cy + half; py++)
      for (let px = Math.floor(p.cx - half); px < p.cx + half; px++) {
        let sum = 0;
        let n = 0;
        for (let sy = 0; sy < 4; sy++)
          for (let sx = 0; sx < 4; sx++) {
            const qx = px + (sx + 0.5) / 4 - p.cx;
            const qy = py + (sy + 0.5) / 4 - p.cy;
            // Undo the clockwise turn (y down: q = R·m with R = [[c, −s], [s, c]]), then the mirror.
            const mx = c * qx + s * qy;
            const my = -s * qx + c * qy;
            const v = cell((p.mirrored ? -mx : mx) + CW / 2, my + CH / 2, !p.decoy);
            if (v >= 0) {
              sum += v;
              n++;
            }
          }
        if (n > 0) data[py * w + px] = (data[py * w + px] * (16 - n) + (p.gain * sum + p.offset * n)) / 16;
      }
  }
  const r = rng(5);
  for (let i = 0; i < data.length; i++) {
    // Box–Muller Gaussian noise.
    const g = Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
    data[i] = Math.max(0, Math.min(255, data[i] + noise * g));
  }
  return { width: w, height: h, data };
}

describe("findSimilar on a constructed image", () => {
  const template: Placement = { cx: 60, cy: 50, rotation: 0, mirrored: false, gain: 1, offset: 0 };
  const copies: Placement[] = [
    { cx: 200.3, cy: 60.6, rotation: 90, mirrored: false, gain: 0.7, offset: 30 },
    { cx: 330.5, cy: 70.2, rotation: 180, mirrored: false, gain: 1.2, offset: -20 },
    { cx: 460.8, cy: 80.4, rotation: 0, mirrored: true, gain: 1, offset: 0 },
    { cx: 120.2, cy: 200.9, rotation: 270, mirrored: true, gain: 0.8, offset: 10 },
    { cx: 260.6, cy: 210.5, rotation: 90, mirrored: true, gain: 1.1, offset: 5 },
    { cx: 400.1, cy: 220.3, rotation: 0, mirrored: false, gain: 0.6, offset: 40 },
  ];
  const decoys: Placement[] = [
    { cx: 120.5, cy: 320.5, rotation: 0, mirrored: false, gain: 1, offset: 0, decoy: true },
    { cx: 280.5, cy: 330.5, rotation: 180, mirrored: true, gain: 1, offset: 0, decoy: true },
    { cx: 440.5, cy: 320.5, rotation: 90, mirrored: false, gain: 1, offset: 0, decoy: true },
  ];
  const image = draw(560, 400, [template, ...copies, ...decoys], 8);
  const box = { x: template.cx - CW / 2, y: template.cy - CH / 2, w: CW, h: CH };

  it("finds every copy with its turn and mirror, sub-pixel centres within 0.5 px, and ranks decoys below", async () => {
    const { candidates } = await findSimilar(graySource(image), box, { minScore: 0.5, rotations: [0, 90, 180, 270], mirrored: true });
    const near = (p: Placement) => candidates.find((c) => Math.hypot(c.centre[0] - p.cx, c.centre[1] - p.cy) < 5);
    const found = copies.map((p) => {
      const c = near(p);
      expect(c, `copy at ${p.cx},${p.cy}`).toBeDefined();
      expect([c!.rotation, c!.mirrored], `copy at ${p.cx},${p.cy}`).toEqual([p.rotation, p.mirrored]);
      expect(Math.hypot(c!.centre[0] - p.cx, c!.centre[1] - p.cy)).toBeLessThan(0.5);
      // A turned cell's box is turned too (the cell is not square).
      const turned = p.rotation === 90 || p.rotation === 270;
      expect([c!.box.w, c!.box.h]).toEqual(turned ? [CH, CW] : [CW, CH]);
      return c!.score;
    });
    const decoyScores = decoys.map((p) => near(p)?.score ?? 0);
    expect(Math.max(...decoyScores)).toBeLessThan(Math.min(...found));
    // The template's own place is not a candidate.
    expect(candidates.some((c) => Math.hypot(c.centre[0] - template.cx, c.centre[1] - template.cy) < 5)).toBe(false);
  });

  it("keeps decoys below a minScore that keeps every copy", async () => {
    const { candidates } = await findSimilar(graySource(image), box, { minScore: 0.85, rotations: [0, 90, 180, 270], mirrored: true });
    expect(candidates).toHaveLength(copies.length);
  });

  it("searches only the turns asked for", async () => {
    const { candidates } = await findSimilar(graySource(image), box, { minScore: 0.85, rotations: [0], mirrored: false });
    expect(candidates.map((c) => [Math.round(c.centre[0]), Math.round(c.centre[1])])).toEqual([[400, 220]]);
  });

  it("refuses a box outside the image, a one-pixel box, a minScore outside 0–1 and a uniform box", async () => {
    const src = graySource(image);
    const o = { minScore: 0.7, rotations: [0] as Rotation[], mirrored: false };
    await expect(findSimilar(src, { x: 550, y: 10, w: 48, h: 32 }, o)).rejects.toThrow(/inside/);
    await expect(findSimilar(src, { x: 10, y: 10, w: 1, h: 1 }, o)).rejects.toThrow(/2×2/);
    await expect(findSimilar(src, box, { ...o, minScore: 1.5 })).rejects.toThrow(/minScore/);
    const flat = graySource({ width: 100, height: 100, data: new Float32Array(10000).fill(90) });
    await expect(findSimilar(flat, { x: 10, y: 10, w: 20, h: 20 }, o)).rejects.toThrow(/uniform/);
  });
});
