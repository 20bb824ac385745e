import { describe, it, expect } from "vitest";
import { dieYield, grossDiesPerWafer, waferEstimate } from "./wafer";
import { EstimateInputError } from "./input-error";

describe("waferEstimate", () => {
  it("gives Hennessy & Patterson's 270 and 640 dies on a 300 mm wafer", () => {
    // Hennessy & Patterson, Computer Architecture: A Quantitative Approach, 5th ed., §1.6:
    // 300 mm wafer, 1.5 cm × 1.5 cm die → 270; 1.0 cm × 1.0 cm → 640.
    const big = waferEstimate({ waferDiameterMm: 300, dieWidthMm: 15, dieHeightMm: 15, defectDensityPerCm2: 0.031 });
    expect(big.grossDies).toBe(270);
    const small = waferEstimate({ waferDiameterMm: 300, dieWidthMm: 10, dieHeightMm: 10, defectDensityPerCm2: 0.031 });
    expect(small.grossDies).toBe(640);
  });

  it("gives Hennessy & Patterson's die yield of 0.40", () => {
    // Hennessy & Patterson, 5th ed., §1.6: Y = 1/(1 + D·A)^N, D = 0.031/cm², N = 13.5, A = 2.25 cm² → 0.40
    const est = waferEstimate({
      waferDiameterMm: 300,
      dieWidthMm: 15,
      dieHeightMm: 15,
      defectDensityPerCm2: 0.031,
      model: "bose-einstein",
      complexityFactor: 13.5,
    });
    expect(est.yield).toBeCloseTo(0.4, 2);
    expect(est.goodDies).toBe(Math.floor(270 * est.yield));
  });

  it("obeys the known limits between the yield models", () => {
    // Stapper: the negative binomial tends to Poisson as α → ∞ and equals Seeds' 1/(1 + AD) at α = 1.
    expect(dieYield("negative-binomial", 2, 0.5, 1e7)).toBeCloseTo(Math.exp(-1), 6);
    expect(dieYield("negative-binomial", 2, 0.5, 1)).toBeCloseTo(0.5, 14);
    // Murphy at AD = 1: (1 − e^(−1))² = 0.39958 (hand-worked from Murphy's formula).
    expect(dieYield("murphy", 1, 1)).toBeCloseTo((1 - Math.exp(-1)) ** 2, 14);
    // Poisson is the most pessimistic of the three for clustered-defect models at equal AD.
    for (const ad of [0.1, 0.5, 1, 2]) {
      expect(dieYield("poisson", ad, 1)).toBeLessThan(dieYield("murphy", ad, 1));
      expect(dieYield("poisson", ad, 1)).toBeLessThan(dieYield("negative-binomial", ad, 1));
    }
  });

  it("yields 1 with no defects in every model", () => {
    for (const model of ["poisson", "murphy", "negative-binomial", "bose-einstein"] as const) {
      expect(waferEstimate({ waferDiameterMm: 200, dieWidthMm: 2.4, dieHeightMm: 1.6, defectDensityPerCm2: 0, model }).yield).toBe(1);
    }
  });

  it("warns for a die larger than the wafer", () => {
    expect(grossDiesPerWafer(10, 80)).toBeLessThan(0);
    const est = waferEstimate({ waferDiameterMm: 100, dieWidthMm: 90, dieHeightMm: 90, defectDensityPerCm2: 0.1 });
    expect(est.grossDies).toBe(0);
    expect(est.warnings).toHaveLength(1);
  });

  it("rejects an unknown model and a negative defect density", () => {
    const base = { waferDiameterMm: 200, dieWidthMm: 2, dieHeightMm: 2, defectDensityPerCm2: 0.1 };
    expect(() => waferEstimate({ ...base, defectDensityPerCm2: -1 })).toThrow(EstimateInputError);
    expect(() => waferEstimate({ ...base, model: "gauss" as "poisson" })).toThrow(/model/);
  });
});
