import { describe, it, expect } from "vitest";
import { niceScaleBarLength } from "./scale-bar";

// Expected values worked by hand: the longest bar is umPerScreenPx · targetPx µm; the answer is
// the largest 1/2/5 × 10^n at or below it (the 1-2-5 sequence is common practice for scale
// bars). Unit conversions: 1 µm = 1000 nm, 1 mm = 1000 µm (SI Brochure, BIPM, 9th ed., 2019,
// Table 7, SI prefixes).
describe("niceScaleBarLength", () => {
  it.each([
    // umPerScreenPx, targetPx, longest µm → chosen µm, px, label
    [0.0001, 100, 10e-3, 0.01, 100, "10 nm"], // 0.01 µm fits exactly
    [0.004, 150, 0.6, 0.5, 125, "500 nm"],
    [0.01, 120, 1.2, 1, 100, "1 µm"],
    [0.03, 120, 3.6, 2, 66.667, "2 µm"],
    [0.15, 150, 22.5, 20, 133.333, "20 µm"],
    [1, 100, 100, 100, 100, "100 µm"], // exact fit is taken, not the next size down
    [4, 150, 600, 500, 125, "500 µm"],
    [8, 150, 1200, 1000, 125, "1 mm"],
    [30, 100, 3000, 2000, 66.667, "2 mm"],
    [100, 120, 12000, 10000, 100, "10 mm"],
  ])("at %f µm/px within %i px picks the hand-worked length", (umPerPx, target, _max, lengthUm, px, label) => {
    const bar = niceScaleBarLength(umPerPx, target);
    expect(bar.lengthUm).toBeCloseTo(lengthUm, 12);
    expect(bar.px).toBeCloseTo(px, 3);
    expect(bar.px).toBeLessThanOrEqual(target + 1e-9);
    expect(bar.label).toBe(label);
  });

  it("labels below a nanometre with decimals", () => {
    // 1e-5 µm/px × 60 px = 0.6 nm longest → 0.5 nm.
    expect(niceScaleBarLength(1e-5, 60).label).toBe("0.5 nm");
  });

  it("never exceeds the target and never wastes more than 60 % of it", () => {
    // With 1-2-5 steps the worst gap is 2 → 5 (a 2.5× ratio) and 5 → 10: the bar is always
    // above 40 % of the allowed length (by hand: 2/5 = 0.4).
    for (let umPerPx = 1e-4; umPerPx < 1e3; umPerPx *= 1.37) {
      const bar = niceScaleBarLength(umPerPx, 150);
      expect(bar.px).toBeLessThanOrEqual(150 * (1 + 1e-12));
      expect(bar.px).toBeGreaterThan(150 * 0.4 - 1e-9);
    }
  });

  it("rejects zero, negative and non-finite inputs", () => {
    expect(() => niceScaleBarLength(0, 100)).toThrow(RangeError);
    expect(() => niceScaleBarLength(-1, 100)).toThrow(RangeError);
    expect(() => niceScaleBarLength(1, Number.NaN)).toThrow(RangeError);
    expect(() => niceScaleBarLength(Infinity, 100)).toThrow(RangeError);
  });
});
