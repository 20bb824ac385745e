import { describe, it, expect } from "vitest";
import { isUnderSampled, rayleighResolutionUm } from "./resolution";

describe("rayleighResolutionUm", () => {
  it("gives 235 nm for NA 1.3 at 500 nm", () => {
    // Rayleigh criterion d = 0.61·λ/NA, Born & Wolf, Principles of Optics; check value as listed in REFERENCES.md.
    expect(rayleighResolutionUm(1.3, 500)).toBeCloseTo(0.235, 3);
  });

  it("assumes 550 nm when no wavelength is given", () => {
    // Same published formula, worked by hand: 0.61 × 0.55 µm / 0.45 = 0.7456 µm.
    expect(rayleighResolutionUm(0.45)).toBeCloseTo(0.7456, 4);
  });

  it("refuses a numerical aperture that is not positive", () => {
    expect(() => rayleighResolutionUm(0)).toThrow(RangeError);
    expect(() => rayleighResolutionUm(Number.NaN)).toThrow(RangeError);
  });
});

describe("isUnderSampled", () => {
  it("accepts 0.25 µm pixels under a 20x/0.45 objective", () => {
    // 5 µm camera pixels at 20x give 0.25 µm/px (REFERENCES.md); 20x/0.45 is a typical
    // metallurgical objective (common practice). Nyquist: pixel ≤ d/2 = 0.373 µm is adequate.
    expect(isUnderSampled(0.25, rayleighResolutionUm(0.45))).toBe(false);
  });

  it("flags pixels larger than half the resolved distance", () => {
    // Nyquist sampling rule as stated in REFERENCES.md: pixel size at most d/2.
    expect(isUnderSampled(0.51, 1)).toBe(true);
    expect(isUnderSampled(0.5, 1)).toBe(false);
  });
});
