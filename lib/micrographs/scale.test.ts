import { describe, expect, it } from "vitest";
import { scaleFromCalibration, scaleFromCapture } from "./scale";

describe("scale from capture data", () => {
  it("gives 0.25 µm/px for 5 µm camera pixels at 20x", () => {
    // REFERENCES.md, Scale and optics: pixel pitch / (objective × adapter); worked example 5 µm at 20x → 0.25 µm/px [pub].
    expect(scaleFromCapture({ cameraPixelPitchUm: 5, objectiveMag: 20 })).toBeCloseTo(0.25, 12);
  });
  it("divides by the adapter magnification too", () => {
    // Same published relation with a 0.5x camera adapter: 5 / (20 × 0.5) = 0.5 µm/px (worked by hand).
    expect(scaleFromCapture({ cameraPixelPitchUm: 5, objectiveMag: 20, adapterMag: 0.5 })).toBeCloseTo(0.5, 12);
  });
  it("refuses zero magnification", () => {
    expect(() => scaleFromCapture({ cameraPixelPitchUm: 5, objectiveMag: 0 })).toThrow(RangeError);
  });
});

describe("two-point calibration", () => {
  it("gives the known length over the pixel distance (3-4-5 triangle worked by hand)", () => {
    expect(scaleFromCalibration([0, 0], [300, 400], 100)).toBeCloseTo(0.2, 12);
  });
  it("refuses coincident points and non-positive lengths", () => {
    expect(() => scaleFromCalibration([1, 1], [1, 1], 10)).toThrow(/coincide/);
    expect(() => scaleFromCalibration([0, 0], [1, 1], 0)).toThrow(/positive/);
  });
});
