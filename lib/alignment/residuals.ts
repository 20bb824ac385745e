import { applyAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import type { AlignmentResult, ControlPointPair } from "./types";

/**
 * Residuals of control points under a transform: distance in die µm between each mapped image
 * point and its die point, their RMS, and the worst pair. Used after a fit and when the analyst
 * edits a point against a stored transform.
 */
export function alignmentResiduals(transform: Affine2x3, pairs: readonly ControlPointPair[]): AlignmentResult {
  const residualsUm = pairs.map(({ imagePx, dieUm }) => {
    const [x, y] = applyAffine(transform, imagePx[0], imagePx[1]);
    return Math.hypot(x - dieUm[0], y - dieUm[1]);
  });
  const sumSquares = residualsUm.reduce((s, r) => s + r * r, 0);
  let worstIndex = 0;
  residualsUm.forEach((r, i) => {
    if (r > residualsUm[worstIndex]) worstIndex = i;
  });
  return {
    transform,
    residualsUm,
    rmsUm: residualsUm.length === 0 ? 0 : Math.sqrt(sumSquares / residualsUm.length),
    worstIndex,
  };
}
