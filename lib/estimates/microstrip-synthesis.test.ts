import { describe, it, expect } from "vitest";
import { microstripAnalysis } from "./microstrip";
import { microstripSynthesis, microstripWidthClosedForm } from "./microstrip-synthesis";
import { EstimateInputError } from "./input-error";

describe("microstripWidthClosedForm", () => {
  it("reproduces Pozar Example 3.7", () => {
    // Pozar, Microwave Engineering, 4th ed., Example 3.7 (eq. 3.197): εr 2.20, 50 Ω → W/d = 3.081
    expect(microstripWidthClosedForm(50, 2.2)).toBeCloseTo(3.081, 3);
  });

  it("uses the narrow-strip branch for high impedances", () => {
    // Pozar eq. 3.197, first branch (W/d < 2); checked by the H&J analysis landing near Z0.
    const u = microstripWidthClosedForm(90, 9.8);
    expect(u).toBeLessThan(2);
    const z0 = microstripAnalysis({ widthUm: u * 100, heightUm: 100, er: 9.8 }).z0Ohm;
    expect(Math.abs(z0 - 90) / 90).toBeLessThan(0.02);
  });
});

describe("microstripSynthesis", () => {
  it("matches Pozar Example 3.7 for width and effective permittivity", () => {
    // Pozar, Microwave Engineering, 4th ed., Example 3.7: W = 0.391 cm on d = 0.127 cm, εe ≈ 1.87.
    // Pozar's closed forms are accurate to about 1 %, so compare within 1 %.
    const est = microstripSynthesis({ z0Ohm: 50, heightUm: 1270, er: 2.2 });
    expect(Math.abs(est.widthUm - 3910) / 3910).toBeLessThan(0.01);
    expect(Math.abs(est.effectivePermittivity - 1.87) / 1.87).toBeLessThan(0.01);
  });

  it("is inverted by the analysis within 0.1 % over a sweep", () => {
    for (const er of [1, 2.2, 3.8, 9.8, 11.9, 12.9]) {
      for (const z0Ohm of [20, 35, 50, 75, 100, 130]) {
        for (const thicknessUm of [0, 2]) {
          const w = microstripSynthesis({ z0Ohm, heightUm: 100, er, thicknessUm }).widthUm;
          const back = microstripAnalysis({ widthUm: w, heightUm: 100, er, thicknessUm }).z0Ohm;
          expect(Math.abs(back - z0Ohm) / z0Ohm).toBeLessThan(1e-3);
        }
      }
    }
  });

  it("recovers the width an analysis started from", () => {
    for (const widthUm of [10, 70, 250, 900]) {
      const z0Ohm = microstripAnalysis({ widthUm, heightUm: 100, er: 12.9 }).z0Ohm;
      const back = microstripSynthesis({ z0Ohm, heightUm: 100, er: 12.9 }).widthUm;
      expect(Math.abs(back - widthUm) / widthUm).toBeLessThan(1e-3);
    }
  });

  it("rejects an impedance no width can give", () => {
    expect(() => microstripSynthesis({ z0Ohm: 2000, heightUm: 100, er: 4 })).toThrow(EstimateInputError);
    expect(() => microstripSynthesis({ z0Ohm: 0, heightUm: 100, er: 4 })).toThrow(/z0Ohm/);
  });
});
