import { composeAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import type { ControlPointPair } from "./types";

type Xy = [number, number];

/**
 * Control points centred on their centroids, with image points in the working frame: (x, −y)
 * for an ordinary photo, so that image and die frame share handedness and the sought linear
 * part is a proper rotation (or an affine map with positive determinant); (x, y) for a mirrored
 * photo, whose mirror already cancels the y flip.
 */
export type CentredPairs = {
  readonly ySign: 1 | -1;
  readonly source: Xy[];
  readonly target: Xy[];
  readonly sourceMean: Xy;
  readonly targetMean: Xy;
};

function mean(points: readonly Xy[]): Xy {
  const n = points.length;
  return [points.reduce((s, p) => s + p[0], 0) / n, points.reduce((s, p) => s + p[1], 0) / n];
}

/** Maps pairs into the working frame and centres both sets. */
export function centrePairs(pairs: readonly ControlPointPair[], mirrored: boolean): CentredPairs {
  const ySign = mirrored ? 1 : -1;
  const rawSource = pairs.map((p): Xy => [p.imagePx[0], ySign * p.imagePx[1]]);
  const rawTarget = pairs.map((p): Xy => [p.dieUm[0], p.dieUm[1]]);
  const sourceMean = mean(rawSource);
  const targetMean = mean(rawTarget);
  return {
    ySign,
    source: rawSource.map((p): Xy => [p[0] - sourceMean[0], p[1] - sourceMean[1]]),
    target: rawTarget.map((p): Xy => [p[0] - targetMean[0], p[1] - targetMean[1]]),
    sourceMean,
    targetMean,
  };
}

/**
 * Turns a linear part M found in the working frame into the image px → die µm transform:
 * die = M·(working − sourceMean) + targetMean, working = diag(1, ySign)·image.
 */
export function toImageTransform(m: readonly [number, number, number, number], c: CentredPairs): Affine2x3 {
  const [a, b, cc, d] = m;
  const tx = c.targetMean[0] - (a * c.sourceMean[0] + b * c.sourceMean[1]);
  const ty = c.targetMean[1] - (cc * c.sourceMean[0] + d * c.sourceMean[1]);
  return composeAffine(
    [
      [a, b, tx],
      [cc, d, ty],
    ],
    [
      [1, 0, 0],
      [0, c.ySign, 0],
    ],
  );
}
