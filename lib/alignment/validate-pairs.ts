import { AlignmentInputError } from "./alignment-input-error";
import type { ControlPointPair } from "./types";

type Xy = readonly [number, number];

/**
 * Two points closer than this fraction of the set's extent count as the same point: far below
 * any clicking precision, far above rounding noise.
 */
const COINCIDENT_FRACTION = 1e-9;

/**
 * Points whose scatter is thinner than this (ratio of the scatter matrix's eigenvalues, i.e. a
 * width under 1/10,000 of the length) count as collinear: an affine fit from them would be
 * decided by clicking error alone.
 */
const COLLINEAR_EIGEN_RATIO = 1e-8;

/** Throws AlignmentInputError unless there are enough pairs, all finite, none coincident. */
export function checkPairs(pairs: readonly ControlPointPair[], minPairs: number, model: string): void {
  if (!Array.isArray(pairs) || pairs.length < minPairs) {
    const count = Array.isArray(pairs) ? pairs.length : 0;
    throw new AlignmentInputError(`${model} alignment needs at least ${minPairs} control points; got ${count}`);
  }
  pairs.forEach((pair, i) => {
    const values = [...(pair?.imagePx ?? []), ...(pair?.dieUm ?? [])];
    if (values.length !== 4 || !values.every((v) => typeof v === "number" && Number.isFinite(v))) {
      throw new AlignmentInputError(`control point ${i + 1} has a missing, NaN or infinite coordinate`, [i]);
    }
  });
  rejectCoincident(
    pairs.map((p) => p.imagePx),
    "image",
  );
  rejectCoincident(
    pairs.map((p) => p.dieUm),
    "die",
  );
}

function extent(points: readonly Xy[]): number {
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  return Math.hypot(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
}

function rejectCoincident(points: readonly Xy[], side: "image" | "die"): void {
  const tolerance = COINCIDENT_FRACTION * extent(points);
  for (let i = 0; i < points.length; i++) {
    for (let j = i + 1; j < points.length; j++) {
      if (Math.hypot(points[i][0] - points[j][0], points[i][1] - points[j][1]) <= tolerance) {
        throw new AlignmentInputError(`control points ${i + 1} and ${j + 1} are at the same ${side} position; move or remove one`, [i, j]);
      }
    }
  }
}

/** True when the points lie on one straight line (within COLLINEAR_EIGEN_RATIO). */
export function areCollinear(points: readonly Xy[]): boolean {
  const n = points.length;
  const mx = points.reduce((s, p) => s + p[0], 0) / n;
  const my = points.reduce((s, p) => s + p[1], 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (const [x, y] of points) {
    sxx += (x - mx) ** 2;
    sxy += (x - mx) * (y - my);
    syy += (y - my) ** 2;
  }
  const largest = (sxx + syy + Math.hypot(sxx - syy, 2 * sxy)) / 2;
  // The smaller eigenvalue as det/largest avoids the cancellation of (trace − root)/2.
  const smallest = (sxx * syy - sxy * sxy) / largest;
  return !(largest > 0) || smallest <= COLLINEAR_EIGEN_RATIO * largest;
}
