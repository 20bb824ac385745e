import { describe, it, expect } from "vitest";
import { Matrix, pseudoInverse, solve } from "ml-matrix";
import { determinant } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import { AlignmentInputError } from "./alignment-input-error";
import { solveAffine } from "./affine-fit";
import { pairsThrough, seededGaussian, similarityTransform } from "./test-support";
import type { ControlPointPair } from "./types";

const spread: [number, number][] = [
  [150, 220],
  [5800, 310],
  [6020, 3900],
  [240, 3720],
  [3100, 2000],
  [4500, 1200],
];
// A general affine with slight shear and unequal axis scales, y flipped (negative determinant).
const sheared: Affine2x3 = [
  [0.41, 0.012, 100.5],
  [0.009, -0.405, 1700.25],
];

function expectTransformClose(actual: Affine2x3, expected: readonly (readonly number[])[], tol: number): void {
  for (let r = 0; r < 2; r++) {
    for (let c = 0; c < 3; c++) {
      expect(Math.abs(actual[r][c] - expected[r][c])).toBeLessThan(tol * Math.max(1, Math.abs(expected[r][c])));
    }
  }
}

/** Design matrix of the 6-parameter affine in raw image px (no flip, no centring). */
function design(pairs: readonly ControlPointPair[]) {
  const rows: number[][] = [];
  const rhs: number[] = [];
  for (const {
    imagePx: [x, y],
    dieUm: [u, v],
  } of pairs) {
    rows.push([x, y, 1, 0, 0, 0], [0, 0, 0, x, y, 1]);
    rhs.push(u, v);
  }
  return { a: new Matrix(rows), b: Matrix.columnVector(rhs) };
}

const asTransform = (p: number[]): Affine2x3 => [
  [p[0], p[1], p[2]],
  [p[3], p[4], p[5]],
];

describe("solveAffine: exact data", () => {
  it("recovers a sheared transform from three pairs", () => {
    const result = solveAffine(pairsThrough(sheared, spread.slice(0, 3)));
    expectTransformClose(result.transform, sheared, 1e-11);
    expect(result.rmsUm).toBeLessThan(1e-9);
  });

  it("recovers rotation 1.5°, scale 1.02, shift and y flip from six pairs", () => {
    const truth = similarityTransform(0.4 * 1.02, 1.5, -35.5, 1642.25);
    const result = solveAffine(pairsThrough(truth, spread));
    expectTransformClose(result.transform, truth, 1e-11);
    expect(Math.max(...result.residualsUm)).toBeLessThan(1e-9);
  });

  it("recovers a mirrored photo's transform when told it is mirrored", () => {
    const truth = similarityTransform(0.4, 3, 50, 60, true);
    const result = solveAffine(pairsThrough(truth, spread), { mirrored: true });
    expectTransformClose(result.transform, truth, 1e-11);
    expect(determinant(result.transform)).toBeGreaterThan(0);
  });
});

describe("solveAffine: noisy data", () => {
  const g = seededGaussian(7);
  const noisy = pairsThrough(sheared, spread, () => 0.5 * g());

  it("matches ml-matrix's QR least squares on the design matrix", () => {
    const { a, b } = design(noisy);
    const reference = asTransform(solve(a, b).to1DArray()); // ml-matrix solve (QR for non-square)
    expectTransformClose(solveAffine(noisy).transform, reference, 1e-9);
  });

  it("matches ml-matrix's SVD pseudo-inverse solution", () => {
    const { a, b } = design(noisy);
    const reference = asTransform(pseudoInverse(a).mmul(b).to1DArray()); // Moore–Penrose, ml-matrix
    expectTransformClose(solveAffine(noisy).transform, reference, 1e-8);
  });

  it("reports per-point residuals and RMS of the least-squares fit", () => {
    const { a, b } = design(noisy);
    const reference = solve(a, b);
    const r = a.mmul(reference).sub(b).to1DArray(); // residual vector of ml-matrix's fit
    const expected = noisy.map((_, i) => Math.hypot(r[2 * i], r[2 * i + 1]));
    const result = solveAffine(noisy);
    result.residualsUm.forEach((value, i) => expect(value).toBeCloseTo(expected[i], 8));
    expect(result.rmsUm).toBeCloseTo(Math.sqrt(expected.reduce((s, v) => s + v * v, 0) / expected.length), 8);
    expect(result.worstIndex).toBe(expected.indexOf(Math.max(...expected)));
  });
});

describe("solveAffine: handedness", () => {
  const mirroredPairs = pairsThrough(similarityTransform(0.4, 1.5, 10, 20, true), spread);

  it("rejects a mirrored fit unless told the photo is mirrored", () => {
    expect(() => solveAffine(mirroredPairs)).toThrow(/fit a mirrored photo/);
    expect(() => solveAffine(mirroredPairs, { mirrored: true })).not.toThrow();
  });

  it("rejects an ordinary fit when told the photo is mirrored", () => {
    expect(() => solveAffine(pairsThrough(sheared, spread), { mirrored: true })).toThrow(/not mirrored/);
  });
});

describe("solveAffine: degenerate input", () => {
  const good = pairsThrough(sheared, spread);

  it("needs at least three pairs", () => {
    expect(() => solveAffine(good.slice(0, 2))).toThrow(/at least 3 control points; got 2/);
  });

  it("rejects collinear image points", () => {
    const line = pairsThrough(sheared, [
      [0, 0],
      [100, 100],
      [250, 250],
      [400, 400],
    ]);
    expect(() => solveAffine(line)).toThrow(/image control points lie on one line/);
  });

  it("rejects collinear die points", () => {
    const flat: ControlPointPair[] = [
      { imagePx: [0, 0], dieUm: [0, 0] },
      { imagePx: [100, 0], dieUm: [10, 0] },
      { imagePx: [0, 100], dieUm: [20, 0] },
    ];
    expect(() => solveAffine(flat)).toThrow(/die control points lie on one line/);
  });

  it("rejects coincident points and non-finite values", () => {
    expect(() => solveAffine([...good, good[2]])).toThrow(AlignmentInputError);
    expect(() => solveAffine([...good, { imagePx: [1, Number.NEGATIVE_INFINITY], dieUm: [0, 0] }])).toThrow(/infinite/);
  });
});
