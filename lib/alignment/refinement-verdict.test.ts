import { describe, it, expect } from "vitest";
import { phaseCorrelate } from "./phase-correlation";
import { judgeRefinement, MIN_MATCH_STRENGTH } from "./refinement-verdict";

/** Deterministic uniform noise (a 32-bit LCG, Numerical Recipes' constants). */
function noise(n: number, seed: number): Float64Array {
  const out = new Float64Array(n);
  let s = seed >>> 0;
  for (let i = 0; i < n; i++) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    out[i] = s / 2 ** 32;
  }
  return out;
}

describe("judgeRefinement", () => {
  it("offers a refinement that lowers the RMS with a strong match", () => {
    const v = judgeRefinement({ rmsBeforeUm: 15, rmsAfterUm: 1.2, peak: 0.3 });
    expect(v).toMatchObject({ improved: true, strongEnough: true, proposed: true });
    expect(v.reason).toMatch(/improves the fit.*15\.00 µm before, 1\.20 µm after/);
  });

  it("does not offer one that makes the fit worse (the case reported: 7.52 → 10.63 µm)", () => {
    const v = judgeRefinement({ rmsBeforeUm: 7.52, rmsAfterUm: 10.63, peak: 0.3 });
    expect(v).toMatchObject({ improved: false, proposed: false });
    expect(v.reason).toMatch(/does not improve the fit/);
  });

  it("does not offer one that leaves the RMS as it was (less than 0.01 µm better)", () => {
    expect(judgeRefinement({ rmsBeforeUm: 3.004, rmsAfterUm: 3.0, peak: 0.5 }).proposed).toBe(false);
  });

  it("does not offer a weak match, even with a lower RMS", () => {
    const v = judgeRefinement({ rmsBeforeUm: 7.52, rmsAfterUm: 5, peak: 0.05 });
    expect(v).toMatchObject({ strongEnough: false, improved: true, proposed: false });
    expect(v.reason).toMatch(/too weakly to use \(match strength 0\.05, below 0\.10\)/);
  });

  it("offers a strong match when there are no control points to check it on", () => {
    expect(judgeRefinement({ rmsBeforeUm: null, rmsAfterUm: null, peak: 0.2 })).toMatchObject({ improved: null, proposed: true });
  });

  it("puts the threshold well above the peak of two unrelated images", () => {
    // Extreme-value bound for N normal values of variance 1/N: √(2 ln N / N) ≈ 0.018 at 256².
    const n = 256;
    const { peak } = phaseCorrelate(noise(n * n, 1), noise(n * n, 2), n, n);
    expect(peak).toBeLessThan(2 * Math.sqrt((2 * Math.log(n * n)) / (n * n)));
    expect(peak).toBeLessThan(MIN_MATCH_STRENGTH / 2);
  });
});
