import { describe, it, expect } from "vitest";
import { alignmentResiduals } from "./residuals";

describe("alignmentResiduals", () => {
  it("measures each pair's miss in die µm with the RMS and the worst pair", () => {
    const identity = [
      [1, 0, 0],
      [0, 1, 0],
    ] as const;
    // Misses worked by hand: 0, a 3-4-5 miss of 5 µm, and 1 µm; RMS = √((0 + 25 + 1)/3).
    const result = alignmentResiduals(identity, [
      { imagePx: [10, 10], dieUm: [10, 10] },
      { imagePx: [0, 0], dieUm: [3, 4] },
      { imagePx: [5, 5], dieUm: [5, 6] },
    ]);
    expect(result.residualsUm).toEqual([0, 5, 1]);
    expect(result.rmsUm).toBeCloseTo(Math.sqrt(26 / 3), 12);
    expect(result.worstIndex).toBe(1);
  });
});
