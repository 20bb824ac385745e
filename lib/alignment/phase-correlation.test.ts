import { describe, it, expect } from "vitest";
import { phaseCorrelate } from "./phase-correlation";
import { rasterise, spotScene } from "./synthetic-image";

// Checks against shifts known by construction: the moving image is the same analytic scene
// moved by (dx, dy) (Kuglin & Hudson 1975: the correlation peak sits at the shift).
const scene = spotScene(11, 120, 128);

describe("phaseCorrelate", () => {
  it("recovers an integer circular shift exactly, peak 1, without a window", () => {
    const w = 64;
    const a = rasterise(scene, w, w);
    const b = new Float64Array(w * w);
    // b(x, y) = a(x − 5, y + 3), wrapped round: a pure circular shift by (5, −3).
    for (let y = 0; y < w; y++) for (let x = 0; x < w; x++) b[y * w + x] = a[((y + 3 + w) % w) * w + ((x - 5 + w) % w)];
    const s = phaseCorrelate(a, b, w, w, { window: false });
    expect(s.dx).toBeCloseTo(5, 9);
    expect(s.dy).toBeCloseTo(-3, 9);
    // Removing the mean empties the DC bin, so the peak is 1 − 1/(64·64), not 1.
    expect(s.peak).toBeCloseTo(1 - 1 / 4096, 9);
  });

  it("recovers a fractional shift of a scene within 0.15 px", () => {
    const a = rasterise(scene, 128, 128);
    const b = rasterise(scene, 128, 128, 7.3, -4.6);
    const s = phaseCorrelate(a, b, 128, 128);
    expect(Math.abs(s.dx - 7.3)).toBeLessThan(0.15);
    expect(Math.abs(s.dy + 4.6)).toBeLessThan(0.15);
  });

  it("finds a far weaker peak between unrelated scenes than between shifted copies", () => {
    const a = rasterise(scene, 128, 128);
    const shifted = phaseCorrelate(a, rasterise(scene, 128, 128, 7.3, -4.6), 128, 128).peak;
    const unrelated = phaseCorrelate(a, rasterise(spotScene(99, 120, 128), 128, 128), 128, 128).peak;
    expect(unrelated).toBeLessThan(shifted / 3);
  });
});
