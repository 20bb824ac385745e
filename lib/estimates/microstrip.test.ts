import { describe, it, expect } from "vitest";
import { microstripAnalysis } from "./microstrip";
import { EstimateInputError } from "./input-error";

describe("microstripAnalysis", () => {
  it("matches the scikit-rf / mcalc Hammerstad & Jensen check value within 1 %", () => {
    // scikit-rf, skrf/media/tests/test_mline.py::test_Z0_ep_reff (value from the mcalc
    // calculator, Hammerstad & Jensen model): w 3.00 mm, h 1.55 mm, t 35 µm, εr 4.413
    // → Z0 49.142 Ω, εe 3.324 (at 1 GHz, within 1 %).
    const est = microstripAnalysis({ widthUm: 3000, heightUm: 1550, er: 4.413, thicknessUm: 35 });
    expect(Math.abs(est.z0Ohm - 49.142) / 49.142).toBeLessThan(0.01);
    expect(Math.abs(est.effectivePermittivity - 3.324) / 3.324).toBeLessThan(0.01);
  });

  it("matches Pozar Example 3.7 in analysis", () => {
    // Pozar, Microwave Engineering, 4th ed., Example 3.7: εr 2.20, d = 0.127 cm, W = 0.391 cm
    // (W/d = 3.081) gives 50 Ω and εe ≈ 1.87.
    const est = microstripAnalysis({ widthUm: 3910, heightUm: 1270, er: 2.2 });
    expect(Math.abs(est.z0Ohm - 50) / 50).toBeLessThan(0.01);
    expect(Math.abs(est.effectivePermittivity - 1.87) / 1.87).toBeLessThan(0.01);
  });

  it("gives the free-space value in air", () => {
    // With εr = 1 the line is homogeneous, so εe = 1 exactly (H&J eq. 3 reduces to 1).
    expect(microstripAnalysis({ widthUm: 100, heightUm: 100, er: 1 }).effectivePermittivity).toBeCloseTo(1, 14);
  });

  it("lowers Z0 as the strip widens", () => {
    let previous = Infinity;
    for (const widthUm of [5, 10, 30, 100, 300, 1000, 3000]) {
      const z0 = microstripAnalysis({ widthUm, heightUm: 200, er: 12.9 }).z0Ohm;
      expect(z0).toBeLessThan(previous);
      previous = z0;
    }
  });

  it("lowers Z0 a little when the strip is thicker", () => {
    const thin = microstripAnalysis({ widthUm: 75, heightUm: 100, er: 12.9 }).z0Ohm;
    const thick = microstripAnalysis({ widthUm: 75, heightUm: 100, er: 12.9, thicknessUm: 3 }).z0Ohm;
    expect(thick).toBeLessThan(thin);
    expect(thin - thick).toBeLessThan(0.05 * thin);
  });

  it("warns outside the stated W/h range", () => {
    expect(microstripAnalysis({ widthUm: 0.5, heightUm: 100, er: 11.9 }).warnings[0]).toMatch(/W\/h/);
    expect(microstripAnalysis({ widthUm: 50, heightUm: 100, er: 11.9 }).warnings).toEqual([]);
  });

  it("rejects er below 1 and a negative thickness", () => {
    expect(() => microstripAnalysis({ widthUm: 50, heightUm: 100, er: 0.5 })).toThrow(EstimateInputError);
    expect(() => microstripAnalysis({ widthUm: 50, heightUm: 100, er: 4, thicknessUm: -1 })).toThrow(/thicknessUm/);
  });
});
