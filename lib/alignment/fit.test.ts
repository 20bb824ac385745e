import { describe, it, expect } from "vitest";
import { checkInsideImage, fitAlignment } from "./fit";
import { pairsThrough, similarityTransform } from "./test-support";

// Points chosen by hand; the transform is a plain rotation-scale-shift with the y flip.
const truth = similarityTransform(0.5, 2, 10, 900);
const points: [number, number][] = [
  [10, 20],
  [900, 40],
  [880, 700],
  [30, 650],
];

describe("fitAlignment", () => {
  it("dispatches to the similarity and affine solvers", () => {
    // Exact data: both models must give back the generating transform (Umeyama 1991; plain least squares).
    for (const model of ["similarity", "affine"] as const) {
      const result = fitAlignment(model, pairsThrough(truth, points));
      expect(result.rmsUm).toBeLessThan(1e-9);
    }
  });

  it("passes the mirrored option on", () => {
    const mirrored = pairsThrough(similarityTransform(0.5, 2, 10, 900, true), points);
    expect(() => fitAlignment("affine", mirrored)).toThrow(/mirrored/);
    expect(fitAlignment("affine", mirrored, { mirrored: true }).rmsUm).toBeLessThan(1e-9);
  });
});

describe("checkInsideImage", () => {
  it("accepts points on the image, edges included", () => {
    expect(() =>
      checkInsideImage(
        pairsThrough(truth, [
          [0, 0],
          [1000, 800],
        ]),
        1000,
        800,
      ),
    ).not.toThrow();
  });

  it("names the first point off the image", () => {
    expect(() =>
      checkInsideImage(
        pairsThrough(truth, [
          [5, 5],
          [1000.5, 10],
        ]),
        1000,
        800,
      ),
    ).toThrow(/control point 2 .* outside/);
    expect(() => checkInsideImage(pairsThrough(truth, [[-1, 5]]), 1000, 800)).toThrow(/control point 1/);
  });
});
