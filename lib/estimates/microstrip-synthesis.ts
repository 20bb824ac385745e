/**
 * Microstrip synthesis: the width for a wanted Z0. The closed-form Wheeler/Hammerstad
 * synthesis (as printed in Pozar, Microwave Engineering, eq. 3.197) gives a starting point;
 * bisection on ln(W/h) then solves the Hammerstad & Jensen analysis exactly, so that
 * analysis(synthesis(Z0)) = Z0 to far better than 0.1 %.
 */
import { EstimateInputError, requireNonNegative, requirePermittivity, requirePositive } from "./input-error";
import { hammerstadJensen, MICROSTRIP_FORMULA, MICROSTRIP_SOURCE, microstripWarnings } from "./microstrip";
import type { EstimateMeta } from "./types";

export type MicrostripSynthesisInput = { z0Ohm: number; heightUm: number; er: number; thicknessUm?: number };
export type MicrostripSynthesisEstimate = EstimateMeta & {
  widthUm: number;
  z0Ohm: number;
  effectivePermittivity: number;
  widthOverHeight: number;
  /** The closed-form starting value of W/h, before refinement. */
  closedFormWidthOverHeight: number;
};

/**
 * Closed-form W/h for impedance z0 on permittivity er (Wheeler; Hammerstad), the two-branch
 * form in Pozar eq. 3.197. It uses 377 Ω for η0 as printed.
 */
export function microstripWidthClosedForm(z0: number, er: number): number {
  const a = (z0 / 60) * Math.sqrt((er + 1) / 2) + ((er - 1) / (er + 1)) * (0.23 + 0.11 / er);
  const narrow = (8 * Math.exp(a)) / (Math.exp(2 * a) - 2);
  if (narrow > 0 && narrow < 2) return narrow;
  const b = (377 * Math.PI) / (2 * z0 * Math.sqrt(er));
  return (2 / Math.PI) * (b - 1 - Math.log(2 * b - 1) + ((er - 1) / (2 * er)) * (Math.log(b - 1) + 0.39 - 0.61 / er));
}

/** Range of W/h searched; beyond it the analysis formulas are far outside their validity. */
const LN_U_MIN = Math.log(1e-4);
const LN_U_MAX = Math.log(1e4);

/**
 * Brackets the root around the closed-form start (widening the bracket by e^±step until Z0
 * changes side), then bisects. Z0 falls monotonically as the strip widens, so this converges.
 */
function solveWidth(z0: number, er: number, tn: number, start: number): number {
  const excess = (lnU: number) => hammerstadJensen(Math.exp(lnU), er, tn).z0 - z0;
  const centre = Number.isFinite(start) && start > 0 ? Math.log(start) : 0;
  let lo = Math.max(LN_U_MIN, centre - 0.25);
  let hi = Math.min(LN_U_MAX, centre + 0.25);
  for (let step = 0.5; excess(lo) < 0 && lo > LN_U_MIN; step *= 2) lo = Math.max(LN_U_MIN, lo - step);
  for (let step = 0.5; excess(hi) > 0 && hi < LN_U_MAX; step *= 2) hi = Math.min(LN_U_MAX, hi + step);
  if (excess(lo) < 0 || excess(hi) > 0) {
    throw new EstimateInputError("z0Ohm", "z0Ohm cannot be reached on this substrate within 0.0001 ≤ W/h ≤ 10000");
  }
  for (let i = 0; i < 200 && hi - lo > 1e-13; i++) {
    const mid = (lo + hi) / 2;
    if (excess(mid) > 0) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

/** Width of a microstrip with the wanted characteristic impedance. */
export function microstripSynthesis(input: MicrostripSynthesisInput): MicrostripSynthesisEstimate {
  const z0 = requirePositive("z0Ohm", input.z0Ohm);
  const h = requirePositive("heightUm", input.heightUm);
  const er = requirePermittivity("er", input.er);
  const t = requireNonNegative("thicknessUm", input.thicknessUm ?? 0);
  const start = microstripWidthClosedForm(z0, er);
  const u = solveWidth(z0, er, t / h, start);
  const { z0: achieved, ee } = hammerstadJensen(u, er, t / h);
  return {
    widthUm: u * h,
    z0Ohm: achieved,
    effectivePermittivity: ee,
    widthOverHeight: u,
    closedFormWidthOverHeight: start,
    units: { widthUm: "µm", z0Ohm: "Ω", effectivePermittivity: "1", widthOverHeight: "1", closedFormWidthOverHeight: "1" },
    formula: `${MICROSTRIP_FORMULA}, solved for W by bisection from the Wheeler/Hammerstad closed form (Pozar eq. 3.197)`,
    source: `${MICROSTRIP_SOURCE}; Pozar, Microwave Engineering, 4th ed., §3.8`,
    warnings: microstripWarnings(u, er, t / h),
  };
}
