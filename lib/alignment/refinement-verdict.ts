/**
 * Lowest match strength (phase-correlation peak height, 0…1) at which a refinement is used.
 * Unrelated images give a correlation surface of noise whose highest value is about
 * √(2 ln N / N) for N grid px (the largest of N normal values of variance 1/N): 0.02 on a 256²
 * grid, 0.005 on the 1024² grid of the last pass; a real common feature stands well above that. 0.1 is a rule of thumb from memory, not a published standard: below it the peak is
 * too weak to trust the shift it points at.
 */
export const MIN_MATCH_STRENGTH = 0.1;

/** The smallest drop in RMS (µm) that counts as an improvement: one unit of the 2 decimals shown. */
const MIN_RMS_GAIN_UM = 0.01;

export type RefinementVerdict = {
  /** RMS on the control points went down by at least MIN_RMS_GAIN_UM; null without control points. */
  readonly improved: boolean | null;
  /** The correlation peak reaches MIN_MATCH_STRENGTH. */
  readonly strongEnough: boolean;
  /** Offer the refined transform for acceptance: strong enough and not worse on the control points. */
  readonly proposed: boolean;
  /** One sentence for the analyst saying why it is or is not offered. */
  readonly reason: string;
};

const um = (v: number) => `${v.toFixed(2)} µm`;

/**
 * Judges a proposed refinement. A refinement is only offered when the correlation found a
 * usable match and the fit on the analyst's control points did not get worse; otherwise the
 * control-point fit stays the one to accept.
 */
export function judgeRefinement(r: { rmsBeforeUm: number | null; rmsAfterUm: number | null; peak: number }): RefinementVerdict {
  const strongEnough = Number.isFinite(r.peak) && r.peak >= MIN_MATCH_STRENGTH;
  const known = r.rmsBeforeUm !== null && r.rmsAfterUm !== null && Number.isFinite(r.rmsBeforeUm) && Number.isFinite(r.rmsAfterUm);
  const improved = known ? r.rmsAfterUm! <= r.rmsBeforeUm! - MIN_RMS_GAIN_UM : null;
  const strength = `match strength ${r.peak.toFixed(2)}`;
  let reason: string;
  if (!strongEnough) reason = `The images matched too weakly to use (${strength}, below ${MIN_MATCH_STRENGTH.toFixed(2)}); keep the control-point fit.`;
  else if (improved === false)
    reason = `It does not improve the fit: RMS on the control points ${um(r.rmsBeforeUm!)} before, ${um(r.rmsAfterUm!)} after; keep the control-point fit.`;
  else if (improved === null) reason = `The images matched (${strength}); there are no control points to check it against.`;
  else reason = `It improves the fit: RMS on the control points ${um(r.rmsBeforeUm!)} before, ${um(r.rmsAfterUm!)} after (${strength}).`;
  return { improved, strongEnough, proposed: strongEnough && improved !== false, reason };
}
