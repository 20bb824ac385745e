import { describe, expect, it } from "vitest";
import { overlapEdgeNcc } from "./correlation";
import type { GreyPatch } from "./patch";

// Ground truth built here: a flat grey overlap under a smooth shading ramp (what flat-field
// correction leaves of a featureless area) has no structure, so no shift can match it.
function patch(width: number, height: number, value: (x: number, y: number) => number): GreyPatch {
  const data = new Float32Array(width * height);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) data[y * width + x] = value(x, y);
  return { data, x0: 0, y0: 0, width, height };
}

describe("overlapEdgeNcc", () => {
  it("scores a blank overlap under smooth shading 0, whatever the shift", () => {
    const shade = (x: number, y: number) => 110 * (1 + 0.1 * ((x - 200) / 200) ** 2 + 0.05 * (y / 300));
    const a = patch(400, 300, shade);
    const b = patch(400, 300, (x, y) => shade(x + 300, y) * 1.02);
    for (const tx of [290, 300, 310, 332]) expect(overlapEdgeNcc(a, b, tx, 0).ncc).toBe(0);
  });

  it("scores shared structure near 1 at the true shift and low elsewhere", () => {
    const texture = (x: number, y: number) => 100 + 40 * Math.sin(x * 0.7) * Math.cos(y * 0.45) + 20 * Math.sin(x * 0.13 + y * 0.29);
    const a = patch(400, 300, texture);
    const b = patch(400, 300, (x, y) => texture(x + 300, y));
    expect(overlapEdgeNcc(a, b, 300, 0).ncc).toBeGreaterThan(0.99);
    expect(overlapEdgeNcc(a, b, 303, 0).ncc).toBeLessThan(0.5);
  });
});
