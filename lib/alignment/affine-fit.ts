import { AlignmentInputError, handednessMessage } from "./alignment-input-error";
import { alignmentResiduals } from "./residuals";
import type { AlignmentOptions, AlignmentResult, ControlPointPair } from "./types";
import { areCollinear, checkPairs } from "./validate-pairs";
import { centrePairs, toImageTransform } from "./working-frame";

/**
 * Least-squares linear part M = Sqp·Spp⁻¹ from centred points (the normal equations of the
 * affine fit after the translation is eliminated by centring), M as [a, b, c, d] row-major.
 */
function linearLeastSquares(source: readonly [number, number][], target: readonly [number, number][]) {
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  let ux = 0;
  let uy = 0;
  let vx = 0;
  let vy = 0;
  source.forEach(([x, y], i) => {
    const [u, v] = target[i];
    sxx += x * x;
    sxy += x * y;
    syy += y * y;
    ux += u * x;
    uy += u * y;
    vx += v * x;
    vy += v * y;
  });
  const det = sxx * syy - sxy * sxy;
  // Spp⁻¹ = [syy −sxy; −sxy sxx]/det; rows of M are the target rows times it.
  return [(ux * syy - uy * sxy) / det, (uy * sxx - ux * sxy) / det, (vx * syy - vy * sxy) / det, (vy * sxx - vx * sxy) / det] as const;
}

/**
 * Fits a general affine transform from image px to die µm to 3 or more non-collinear control
 * points by linear least squares. Rejects a fit whose handedness is wrong for the photo (an
 * ordinary photo must flip y; a `mirrored` one must not) with AlignmentInputError, as well as
 * too few, non-finite, coincident or collinear points.
 */
export function solveAffine(pairs: readonly ControlPointPair[], options: AlignmentOptions = {}): AlignmentResult {
  checkPairs(pairs, 3, "affine");
  if (areCollinear(pairs.map((p) => p.imagePx))) {
    throw new AlignmentInputError("the image control points lie on one line; affine alignment needs them spread out");
  }
  if (areCollinear(pairs.map((p) => p.dieUm))) {
    throw new AlignmentInputError("the die control points lie on one line; affine alignment needs them spread out");
  }
  const mirrored = options.mirrored ?? false;
  const centred = centrePairs(pairs, mirrored);
  const m = linearLeastSquares(centred.source, centred.target);
  const det = m[0] * m[3] - m[1] * m[2];
  const size = m.reduce((s, v) => s + v * v, 0);
  if (!(det > 1e-12 * size)) {
    throw new AlignmentInputError(det < 0 ? handednessMessage(mirrored) : "the control points do not determine a transform");
  }
  return alignmentResiduals(toImageTransform(m, centred), pairs);
}
