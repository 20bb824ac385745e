import { describe, it, expect } from "vitest";
import { Matrix, inverse } from "ml-matrix";
import type { Affine2x3 } from "./types";
import { diePoint, imagePoint } from "./types";
import { applyAffine, composeAffine, determinant, dieToImage, frameFromScale, imageToDie, invertAffine, meanScale } from "./affine";

const homogeneous = (m: Affine2x3) => new Matrix([[...m[0]], [...m[1]], [0, 0, 1]]);

/** Entry-wise comparison relative to the entry's size (translations run to thousands of px). */
function expectAffineClose(actual: Affine2x3, expected: number[][]): void {
  for (let r = 0; r < 2; r++) {
    for (let c = 0; c < 3; c++) {
      expect(Math.abs(actual[r][c] - expected[r][c])).toBeLessThan(1e-12 * Math.max(1, Math.abs(expected[r][c])));
    }
  }
}

// A later micrograph: 0.4 µm/px, rotated 1.5°, scaled 1.02, y flipped, shifted.
const theta = (1.5 * Math.PI) / 180;
const s = 0.4 * 1.02;
const aligned: Affine2x3 = [
  [s * Math.cos(theta), s * Math.sin(theta), 120.5],
  [s * Math.sin(theta), -s * Math.cos(theta), 1730.25],
];

describe("frameFromScale", () => {
  it("puts the bottom-left pixel corner at the die origin with y up", () => {
    // 5 µm camera pixels at 20x give 0.25 µm/px (REFERENCES.md, Scale and optics).
    const m = frameFromScale(5 / 20, 4000);
    expect(applyAffine(m, 0, 4000)).toEqual([0, 0]);
    expect(applyAffine(m, 0, 0)).toEqual([0, 1000]); // top-left pixel: 4000 px · 0.25 µm up
    expect(applyAffine(m, 9600, 0)).toEqual([2400, 1000]);
    expect(determinant(m)).toBeLessThan(0);
    expect(meanScale(m)).toBe(0.25);
  });

  it("adds an origin offset", () => {
    expect(applyAffine(frameFromScale(0.5, 100, [10, 20]), 0, 100)).toEqual([10, 20]);
  });
});

describe("invertAffine", () => {
  it("matches ml-matrix's inverse of the homogeneous matrix", () => {
    const expected = inverse(homogeneous(aligned)).to2DArray(); // ml-matrix LU inverse
    expectAffineClose(invertAffine(aligned), expected);
  });

  it("throws on a singular transform", () => {
    expect(() =>
      invertAffine([
        [1, 2, 0],
        [2, 4, 0],
      ]),
    ).toThrow(/singular/);
  });
});

describe("composeAffine", () => {
  it("matches ml-matrix's product outer · inner", () => {
    const inner = frameFromScale(0.25, 4000);
    const expected = homogeneous(aligned).mmul(homogeneous(inner)).to2DArray(); // ml-matrix mmul
    expectAffineClose(composeAffine(aligned, inner), expected);
  });

  it("gives the identity for a transform composed with its inverse", () => {
    expectAffineClose(composeAffine(aligned, invertAffine(aligned)), [
      [1, 0, 0],
      [0, 1, 0],
    ]);
  });
});

describe("image ↔ die round trips", () => {
  it("return to the starting image pixel within 1e-9 µm", () => {
    for (const [x, y] of [
      [0, 0],
      [6000, 4000],
      [1234.5, 987.25],
      [-50, 8000],
    ]) {
      const back = dieToImage(aligned, imageToDie(aligned, imagePoint(x, y)));
      // Error measured in die µm: the pixel error times the scale.
      expect(Math.hypot(back.x - x, back.y - y) * meanScale(aligned)).toBeLessThan(1e-9);
    }
  });

  it("return to the starting die point within 1e-9 µm", () => {
    for (const [x, y] of [
      [0, 0],
      [2400, 1600],
      [1200.125, 800.5],
    ]) {
      const back = imageToDie(aligned, dieToImage(aligned, diePoint(x, y)));
      expect(Math.hypot(back.x - x, back.y - y)).toBeLessThan(1e-9);
    }
  });
});
