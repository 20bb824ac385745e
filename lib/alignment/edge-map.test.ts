import { describe, it, expect } from "vitest";
import { edgeMap } from "./edge-map";

describe("edgeMap", () => {
  it("marks a vertical step with the gradient of its box-blurred profile", () => {
    // A step 0 → 9 between columns 4 and 5. Worked by hand: the 3 × 3 box blur gives the
    // profile 0, 3, 6, 9 at columns 3…6; central differences halved give 1.5, 3, 3, 1.5.
    const w = 10;
    const h = 8;
    const img = new Float64Array(w * h);
    for (let y = 0; y < h; y++) for (let x = 5; x < w; x++) img[y * w + x] = 9;
    const e = edgeMap(img, w, h);
    const row = Array.from(e.subarray(4 * w, 5 * w));
    expect(row).toEqual([0, 0, 0, 1.5, 3, 3, 1.5, 0, 0, 0]);
  });

  it("gives the same map for an image and its negative", () => {
    // |∇(c − f)| = |∇f| (linearity of the gradient): illuminations that swap bright and dark agree.
    const w = 12;
    const img = Float64Array.from({ length: w * w }, (_, k) => ((k * 7919) % 31) * 3);
    const neg = img.map((v) => 255 - v);
    expect(Array.from(edgeMap(neg, w, w)).map((v) => v.toFixed(9))).toEqual(Array.from(edgeMap(img, w, w)).map((v) => v.toFixed(9)));
  });
});
