import { AlignmentInputError, handednessMessage } from "./alignment-input-error";
import { alignmentResiduals } from "./residuals";
import type { AlignmentOptions, AlignmentResult, ControlPointPair } from "./types";
import { checkPairs } from "./validate-pairs";
import { centrePairs, toImageTransform, type CentredPairs } from "./working-frame";

/**
 * We call the points mirrored only when the opposite handedness beats the requested one by
 * this factor in residual sum of squares AND the requested one leaves more than
 * UNEXPLAINED_FRACTION of the die-side scatter unexplained (an RMS miss above about 3 % of the
 * points' spread). With 2 pairs, or (nearly) collinear ones, both handednesses fit about
 * equally and clicking noise must not decide: the request stands. Our own thresholds.
 */
const REFLECTION_MARGIN = 4;
const UNEXPLAINED_FRACTION = 1e-3;

/**
 * Least-squares rotation + uniform scale in the working frame, as M = [a −b; b a]:
 * a = Σ(x'u' + y'v')/Σ|p'|², b = Σ(x'v' − y'u')/Σ|p'|² for centred source p' = (x', y') and
 * target (u', v') (REFERENCES.md, Alignment). In 2-D this is exactly Umeyama's (IEEE TPAMI
 * 13(4), 1991) SVD solution with its guard S = I: rotation angle atan2(b, a) and Umeyama's
 * scale c = tr(DS)/σ²_source = √(a² + b²), not Horn's symmetric √(σ²_target/σ²_source).
 * Returns also the residual sum of squares Σ|q'|² − (a² + b²)·Σ|p'|².
 */
function properFit(source: readonly [number, number][], target: readonly [number, number][]) {
  let sp = 0;
  let sq = 0;
  let sa = 0;
  let sb = 0;
  source.forEach(([x, y], i) => {
    const [u, v] = target[i];
    sp += x * x + y * y;
    sq += u * u + v * v;
    sa += x * u + y * v;
    sb += x * v - y * u;
  });
  const a = sa / sp;
  const b = sb / sp;
  return { a, b, rss: Math.max(0, sq - (a * a + b * b) * sp), sq };
}

function mirrorSource(c: CentredPairs): [number, number][] {
  return c.source.map(([x, y]): [number, number] => [x, -y]);
}

/**
 * Fits a similarity (rotation, uniform scale, shift) from image px to die µm to 2 or more
 * control points by least squares, keeping the handedness the photo must have: the y flip of
 * an ordinary photo, or none when `mirrored` is set. Throws AlignmentInputError on too few,
 * non-finite or coincident points, and when the points clearly imply the other handedness.
 */
export function solveSimilarity(pairs: readonly ControlPointPair[], options: AlignmentOptions = {}): AlignmentResult {
  checkPairs(pairs, 2, "similarity");
  const mirrored = options.mirrored ?? false;
  const centred = centrePairs(pairs, mirrored);
  const wanted = properFit(centred.source, centred.target);
  const other = properFit(mirrorSource(centred), centred.target);
  // Umeyama's guard forces the requested handedness; here we also refuse to hide a mismatch.
  if (wanted.rss > REFLECTION_MARGIN * other.rss && wanted.rss > UNEXPLAINED_FRACTION * wanted.sq) {
    throw new AlignmentInputError(handednessMessage(mirrored));
  }
  if (!(Math.hypot(wanted.a, wanted.b) > 0)) {
    throw new AlignmentInputError("the control points do not determine a scale");
  }
  const { a, b } = wanted;
  return alignmentResiduals(toImageTransform([a, -b, b, a], centred), pairs);
}
