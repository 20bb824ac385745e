import { describe, it, expect } from "vitest";
import { resampleToGrid, sampleBilinear } from "./resample";

// A linear ramp v = 2x + 3y at pixel centres: bilinear interpolation reproduces a linear
// function exactly (by the definition of bilinear interpolation), so values are known by hand.
const width = 6;
const height = 4;
const data = Array.from({ length: width * height }, (_, k) => 2 * ((k % width) + 0.5) + 3 * (Math.floor(k / width) + 0.5));
const ramp = { width, height, data };

describe("sampleBilinear", () => {
  it("reproduces a linear ramp between pixel centres", () => {
    expect(sampleBilinear(ramp, 2.25, 1.75)).toBeCloseTo(2 * 2.25 + 3 * 1.75, 12);
    expect(sampleBilinear(ramp, 0.5, 0.5)).toBeCloseTo(2.5, 12);
  });

  it("gives NaN off the image", () => {
    expect(sampleBilinear(ramp, -0.1, 1)).toBeNaN();
    expect(sampleBilinear(ramp, 1, 4.1)).toBeNaN();
  });
});

describe("resampleToGrid", () => {
  it("samples through the grid-to-image transform and fills what is off the image with the mean", () => {
    // Grid px (i, j) centre → image (i + 0.5 + 1, j + 0.5): a one-pixel shift to the right.
    const { data: out, covered } = resampleToGrid(
      ramp,
      [
        [1, 0, 1],
        [0, 1, 0],
      ],
      6,
      4,
    );
    expect(out[0]).toBeCloseTo(2 * 1.5 + 3 * 0.5, 12);
    expect(covered).toBeCloseTo(20 / 24, 12); // the last column (image x 6.5) is off the image
    const inside = Array.from(out).filter((_, k) => k % 6 !== 5);
    expect(out[5]).toBeCloseTo(inside.reduce((s, v) => s + v, 0) / inside.length, 12);
  });
});
