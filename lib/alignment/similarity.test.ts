import { describe, it, expect } from "vitest";
import { Matrix, SVD, determinant as matDet, solve } from "ml-matrix";
import { determinant } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import { AlignmentInputError } from "./alignment-input-error";
import { solveSimilarity } from "./similarity";
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
// The dark-field case of the demo die: 0.4 µm/px, scaled 1.02, rotated 1.5°, shifted.
const truth = similarityTransform(0.4 * 1.02, 1.5, -35.5, 1642.25);

function expectTransformClose(actual: Affine2x3, expected: readonly (readonly number[])[], tol: number): void {
  for (let r = 0; r < 2; r++) {
    for (let c = 0; c < 3; c++) {
      expect(Math.abs(actual[r][c] - expected[r][c])).toBeLessThan(tol * Math.max(1, Math.abs(expected[r][c])));
    }
  }
}

/**
 * Independent check: the linear 4-parameter least squares die = [a −b; b a]·(x, −y) + t solved
 * by ml-matrix's QR `solve` on the design matrix (REFERENCES.md, Alignment: this linear problem
 * has the same optimum as Umeyama's closed form with the proper-rotation guard).
 */
function linearSimilarity(pairs: readonly ControlPointPair[]): Affine2x3 {
  const rows: number[][] = [];
  const rhs: number[] = [];
  for (const {
    imagePx: [x, y],
    dieUm: [u, v],
  } of pairs) {
    rows.push([x, y, 1, 0]); // u = a·x − b·(−y) + tx
    rows.push([-y, x, 0, 1]); // v = b·x + a·(−y) + ty
    rhs.push(u, v);
  }
  const [a, b, tx, ty] = solve(new Matrix(rows), Matrix.columnVector(rhs)).to1DArray();
  return [
    [a, b, tx],
    [b, -a, ty],
  ];
}

/**
 * Independent check: Umeyama, IEEE TPAMI 13(4), 1991, Theorem (covariance Σxy, its SVD UDVᵀ,
 * S = diag(1, −1) when det U·det V < 0, R = USVᵀ, c = tr(DS)/σ²x, t = µy − cRµx), done with
 * ml-matrix's SVD in flipped image coordinates (x, −y). Returns the transform and both scale
 * estimates.
 */
function umeyamaBySvd(pairs: readonly ControlPointPair[]) {
  const n = pairs.length;
  const src = pairs.map((p) => [p.imagePx[0], -p.imagePx[1]]);
  const dst = pairs.map((p) => [p.dieUm[0], p.dieUm[1]]);
  const mean = (pts: number[][]) => [0, 1].map((k) => pts.reduce((s, p) => s + p[k], 0) / n);
  const [ms, md] = [mean(src), mean(dst)];
  const cs = src.map((p) => [p[0] - ms[0], p[1] - ms[1]]);
  const cd = dst.map((p) => [p[0] - md[0], p[1] - md[1]]);
  const varSrc = cs.reduce((s, p) => s + p[0] ** 2 + p[1] ** 2, 0) / n;
  const varDst = cd.reduce((s, p) => s + p[0] ** 2 + p[1] ** 2, 0) / n;
  const sigma = new Matrix(cd).transpose().mmul(new Matrix(cs)).div(n);
  const svd = new SVD(sigma);
  const u = svd.leftSingularVectors;
  const v = svd.rightSingularVectors;
  const sDiag = matDet(u) * matDet(v) < 0 ? [1, -1] : [1, 1]; // the reflection guard
  const r = u.mmul(Matrix.diag(sDiag)).mmul(v.transpose());
  const c = (svd.diagonal[0] * sDiag[0] + svd.diagonal[1] * sDiag[1]) / varSrc;
  const t = Matrix.columnVector(md)
    .sub(r.mmul(Matrix.columnVector(ms)).mul(c))
    .to1DArray();
  const transform: Affine2x3 = [
    [c * r.get(0, 0), -c * r.get(0, 1), t[0]],
    [c * r.get(1, 0), -c * r.get(1, 1), t[1]],
  ];
  return { transform, umeyamaScale: c, hornScale: Math.sqrt(varDst / varSrc) };
}

describe("solveSimilarity: exact data", () => {
  it("recovers rotation 1.5°, scale 1.02 and the shift from two pairs", () => {
    // Umeyama 1991: noise-free correspondences give the generating transform exactly.
    const result = solveSimilarity(pairsThrough(truth, spread.slice(0, 2)));
    expectTransformClose(result.transform, truth, 1e-12);
    expect(result.rmsUm).toBeLessThan(1e-9);
  });

  it("recovers the same transform from six pairs with zero residuals", () => {
    const result = solveSimilarity(pairsThrough(truth, spread));
    expectTransformClose(result.transform, truth, 1e-12);
    expect(Math.max(...result.residualsUm)).toBeLessThan(1e-9);
    expect(determinant(result.transform)).toBeLessThan(0); // the y flip
    expect(Math.sqrt(-determinant(result.transform))).toBeCloseTo(0.408, 12);
  });

  it("recovers a pure y flip with scale and shift", () => {
    const flip = similarityTransform(0.25, 0, 0, 1000);
    expectTransformClose(solveSimilarity(pairsThrough(flip, spread)).transform, flip, 1e-12);
  });

  it("recovers a mirrored photo's transform when told it is mirrored", () => {
    const mirroredTruth = similarityTransform(0.4, -2, 80, -40, true);
    const result = solveSimilarity(pairsThrough(mirroredTruth, spread), { mirrored: true });
    expectTransformClose(result.transform, mirroredTruth, 1e-12);
    expect(determinant(result.transform)).toBeGreaterThan(0);
  });
});

describe("solveSimilarity: noisy data", () => {
  const noisy = pairsThrough(
    truth,
    spread,
    (() => {
      const g = seededGaussian(20240611);
      return () => 0.5 * g(); // σ = 0.5 µm on each die coordinate
    })(),
  );

  it("matches ml-matrix's linear least squares on the same points", () => {
    const result = solveSimilarity(noisy);
    expectTransformClose(result.transform, linearSimilarity(noisy), 1e-10);
  });

  it("matches Umeyama's SVD solution and uses Umeyama's scale, not Horn's", () => {
    const result = solveSimilarity(noisy);
    const reference = umeyamaBySvd(noisy);
    expectTransformClose(result.transform, reference.transform, 1e-10);
    const scale = Math.sqrt(-determinant(result.transform));
    expect(scale).toBeCloseTo(reference.umeyamaScale, 12);
    // Under noise Horn's symmetric estimate √(σ²_die/σ²_image) differs from Umeyama's.
    expect(Math.abs(scale - reference.hornScale)).toBeGreaterThan(1e-9);
  });

  it("reports residuals as mapped-minus-given distances and their RMS", () => {
    const result = solveSimilarity(noisy);
    const m = linearSimilarity(noisy);
    const expected = noisy.map(({ imagePx: [x, y], dieUm: [u, v] }) =>
      Math.hypot(m[0][0] * x + m[0][1] * y + m[0][2] - u, m[1][0] * x + m[1][1] * y + m[1][2] - v),
    );
    result.residualsUm.forEach((r, i) => expect(r).toBeCloseTo(expected[i], 9));
    expect(result.rmsUm).toBeCloseTo(Math.sqrt(expected.reduce((s, r) => s + r * r, 0) / expected.length), 9);
    expect(result.worstIndex).toBe(expected.indexOf(Math.max(...expected)));
    expect(result.rmsUm).toBeGreaterThan(0.1); // noise is really there
    expect(result.rmsUm).toBeLessThan(1.5);
  });
});

describe("solveSimilarity: reflection guard", () => {
  const mirroredPairs = pairsThrough(similarityTransform(0.4, 1.5, 10, 20, true), spread);

  it("refuses points from a mirrored photo unless told it is mirrored", () => {
    expect(() => solveSimilarity(mirroredPairs)).toThrow(AlignmentInputError);
    expect(() => solveSimilarity(mirroredPairs)).toThrow(/mirrored/);
  });

  it("refuses three well-spread points from a mirrored photo", () => {
    expect(() => solveSimilarity(mirroredPairs.slice(0, 3))).toThrow(AlignmentInputError);
  });

  it("refuses an ordinary photo's points when told it is mirrored", () => {
    expect(() => solveSimilarity(pairsThrough(truth, spread), { mirrored: true })).toThrow(/not mirrored/);
  });

  it("lets clicking noise on three nearly collinear points keep the requested handedness", () => {
    // Nearly collinear points cannot tell a photo from its mirror image: reflecting a line
    // about itself changes nothing (by hand), so noise must not flip the answer. 200 seeded trials.
    const line: [number, number][] = [
      [100, 2000],
      [3000, 2000.5],
      [6000, 2000],
    ];
    for (let seed = 1; seed <= 200; seed++) {
      const g = seededGaussian(seed);
      const result = solveSimilarity(pairsThrough(truth, line, () => 0.5 * g()));
      expect(determinant(result.transform)).toBeLessThan(0);
    }
  });

  it("keeps the requested handedness when two pairs cannot tell", () => {
    const two = pairsThrough(truth, spread.slice(0, 2));
    expect(determinant(solveSimilarity(two).transform)).toBeLessThan(0);
    expect(determinant(solveSimilarity(two, { mirrored: true }).transform)).toBeGreaterThan(0);
  });
});

describe("solveSimilarity: degenerate input", () => {
  const good = pairsThrough(truth, spread.slice(0, 3));

  it("needs at least two pairs", () => {
    expect(() => solveSimilarity(good.slice(0, 1))).toThrow(/at least 2/);
    expect(() => solveSimilarity([])).toThrow(AlignmentInputError);
  });

  it("rejects NaN and infinite coordinates", () => {
    expect(() => solveSimilarity([...good, { imagePx: [Number.NaN, 1], dieUm: [0, 0] }])).toThrow(/control point 4/);
    expect(() => solveSimilarity([...good, { imagePx: [1, 1], dieUm: [Infinity, 0] }])).toThrow(/NaN or infinite/);
  });

  it("rejects coincident image points and coincident die points", () => {
    const sameImage = [good[0], { imagePx: good[0].imagePx, dieUm: [5, 5] as const }, good[1]];
    expect(() => solveSimilarity(sameImage)).toThrow(/1 and 2 are at the same image position/);
    const sameDie = [good[0], good[1], { imagePx: [9, 9] as const, dieUm: good[1].dieUm }];
    expect(() => solveSimilarity(sameDie)).toThrow(/2 and 3 are at the same die position/);
  });
});
