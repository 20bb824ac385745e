import { describe, it, expect } from "vitest";
import { opticsEstimate } from "./optics";
import { EstimateInputError } from "./input-error";

describe("opticsEstimate", () => {
  it("gives 0.25 µm object pixels for 5 µm camera pixels at 20x", () => {
    // Object-space pixel = camera pitch / (objective × adapter): 5 µm / 20 = 0.25 µm (REFERENCES.md, [pub]).
    const est = opticsEstimate({ numericalAperture: 0.45, cameraPixelPitchUm: 5, objectiveMag: 20 });
    expect(est.objectPixelUm).toBeCloseTo(0.25, 14);
    expect(opticsEstimate({ numericalAperture: 0.45, cameraPixelPitchUm: 5, objectiveMag: 20, adapterMag: 0.5 }).objectPixelUm).toBeCloseTo(0.5, 14);
  });

  it("gives a Rayleigh distance of 235 nm at NA 1.3 and 500 nm", () => {
    // Rayleigh d = 0.61·λ/NA: NA 1.3 at 500 nm gives 235 nm (REFERENCES.md, [pub]); oil immersion n = 1.515.
    const est = opticsEstimate({ numericalAperture: 1.3, wavelengthNm: 500, cameraPixelPitchUm: 6.5, objectiveMag: 100, refractiveIndex: 1.515 });
    expect(est.rayleighUm).toBeCloseTo(0.235, 3);
    // Abbe d = λ/(2·NA) = 0.5/2.6 µm
    expect(est.abbeUm).toBeCloseTo(0.5 / 2.6, 12);
    expect(est.warnings).toEqual([]);
  });

  it("computes depth of field by the two-term formula", () => {
    // d = λ·n/NA² + n·e/(M·NA) (Inoué & Spring, 2nd ed., 1997; from memory), worked by
    // hand: 50x/0.80 in air, 550 nm, 5 µm pixels: 0.55/0.64 + 5/(50·0.8) = 0.859375 + 0.125 µm.
    const est = opticsEstimate({ numericalAperture: 0.8, cameraPixelPitchUm: 5, objectiveMag: 50 });
    expect(est.depthOfFieldUm).toBeCloseTo(0.984375, 12);
  });

  it("warns when the sampling is coarser than Nyquist", () => {
    // Nyquist: pixel ≤ d/2 (REFERENCES.md). 5x/0.15 with 6.5 µm pixels: pixel 1.3 µm, d/2 ≈ 1.12 µm.
    const est = opticsEstimate({ numericalAperture: 0.15, cameraPixelPitchUm: 6.5, objectiveMag: 5 });
    expect(est.warnings.some((w) => w.includes("undersampled"))).toBe(true);
    expect(opticsEstimate({ numericalAperture: 0.15, cameraPixelPitchUm: 3.45, objectiveMag: 5 }).warnings).toEqual([]);
  });

  it("warns when NA is not below the medium's index", () => {
    const est = opticsEstimate({ numericalAperture: 1.3, cameraPixelPitchUm: 5, objectiveMag: 100 });
    expect(est.warnings.some((w) => w.includes("refractiveIndex"))).toBe(true);
  });

  it("rejects a zero magnification", () => {
    expect(() => opticsEstimate({ numericalAperture: 0.3, cameraPixelPitchUm: 5, objectiveMag: 0 })).toThrow(EstimateInputError);
  });
});
