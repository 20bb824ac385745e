/**
 * Self inductance of a straight rectangular bar (an on-chip trace or a lead-frame finger)
 * in isolation: Grover (1946) and Terman, Radio Engineers' Handbook (1943).
 */
import { MU0, TO_NH, UM } from "./constants";
import { requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";

export type StripInput = { lengthUm: number; widthUm: number; thicknessUm: number };
export type StripEstimate = EstimateMeta & { inductanceNh: number };

/**
 * L = 2·10⁻⁷·l·[ln(2l/(w + t)) + 0.5 + 0.2235·(w + t)/l] H. The constant 0.2235·(w + t)
 * approximates the bar's geometric mean distance; no ground plane or return path is included,
 * so over a substrate with a nearby ground the loop inductance is lower.
 */
export function stripInductance(input: StripInput): StripEstimate {
  const l = requirePositive("lengthUm", input.lengthUm) * UM;
  const w = requirePositive("widthUm", input.widthUm) * UM;
  const t = requirePositive("thicknessUm", input.thicknessUm) * UM;
  const warnings: string[] = [];
  if (l < 10 * (w + t)) {
    warnings.push("lengthUm is less than 10·(widthUm + thicknessUm): the formula assumes length ≫ width + thickness");
  }
  const henries = (MU0 / (2 * Math.PI)) * l * (Math.log((2 * l) / (w + t)) + 0.5 + (0.2235 * (w + t)) / l);
  return {
    inductanceNh: henries * TO_NH,
    units: { inductanceNh: "nH" },
    formula: "L = 2e-7·l·[ln(2l/(w + t)) + 0.5 + 0.2235·(w + t)/l] H (isolated bar, no ground plane)",
    source: "Grover, Inductance Calculations, 1946; Terman, Radio Engineers' Handbook, 1943",
    warnings,
  };
}
