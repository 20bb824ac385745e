/**
 * Wire-bond inductance from the drawn length and the wire diameter: one straight round wire
 * in free space (Rosa; Grover), or n equal bonds side by side at a constant pitch.
 */
import { TO_NH, UM } from "./constants";
import { EstimateInputError, requireInteger, requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";
import { equalCurrentInductance, inductiveSplitInductance, parallelMutual, partialInductanceMatrix, roundWireSelf } from "./wire-partial-inductance";

export type BondWireInput = {
  lengthUm: number;
  /** Wire diameter; 25 µm is the common gold ball-bond wire. */
  diameterUm?: number;
  /** Number of equal bonds in parallel between the same two points. */
  count?: number;
  /** Centre-to-centre spacing of neighbouring bonds; required when count > 1. */
  pitchUm?: number;
  /** dc: uniform current (−0.75); hf: current on the surface, skin depth ≪ radius (−1). */
  regime?: "dc" | "hf";
};

export type BondWireEstimate = EstimateMeta & {
  /** Inductance of the bond (or of the bundle, each bond carrying the same current). */
  inductanceNh: number;
  /** Self inductance of one bond. */
  selfInductanceNh: number;
  /** Mutual inductance of two neighbouring bonds (count > 1). */
  mutualNh?: number;
  /** Bundle inductance when current divides by inductance alone (count > 1). */
  inductiveSplitNh?: number;
};

/** Largest bundle accepted: the partial-inductance matrix is solved directly. */
const MAX_COUNT = 100;

/**
 * Inductance of one or more parallel wire bonds. For n > 1 the full n×n partial-inductance
 * matrix (self terms on the diagonal, Grover's mutual at |i − j|·pitch off it) is summed:
 * L = (Σᵢ Σⱼ Lᵢⱼ)/n² for equal currents, which is Grover's (L + M)/2 for two bonds.
 * The inductive split 1/(1ᵀL⁻¹1) is returned beside it; both lie between L/n and L.
 */
export function bondWireInductance(input: BondWireInput): BondWireEstimate {
  const lengthUm = requirePositive("lengthUm", input.lengthUm);
  const diameterUm = requirePositive("diameterUm", input.diameterUm ?? 25);
  const count = requireInteger("count", input.count ?? 1, 1, MAX_COUNT);
  const regime = input.regime ?? "dc";
  const warnings: string[] = [];
  if (lengthUm < 10 * diameterUm) {
    warnings.push("lengthUm is less than 10 wire diameters: the formula assumes length ≫ radius");
  }
  const l = lengthUm * UM;
  const self = roundWireSelf(l, (diameterUm * UM) / 2, regime);
  const base = {
    units: { inductanceNh: "nH", selfInductanceNh: "nH", mutualNh: "nH", inductiveSplitNh: "nH" },
    source: "Rosa, Bull. Bureau of Standards 4, 1908; Grover, Inductance Calculations, 1946 (self and mutual inductance of straight wires)",
    warnings,
  };
  if (count === 1) {
    return {
      ...base,
      inductanceNh: self * TO_NH,
      selfInductanceNh: self * TO_NH,
      formula: `L = 2e-7·l·[ln(2l/r) − ${regime === "dc" ? "0.75" : "1"}] H (l, r in m)`,
    };
  }
  const pitchUm = requirePositive("pitchUm", input.pitchUm);
  if (pitchUm <= diameterUm) {
    throw new EstimateInputError("pitchUm", "pitchUm must be larger than diameterUm (the bonds would overlap)");
  }
  const matrix = partialInductanceMatrix(self, l, pitchUm * UM, count);
  return {
    ...base,
    inductanceNh: equalCurrentInductance(matrix) * TO_NH,
    selfInductanceNh: self * TO_NH,
    mutualNh: parallelMutual(l, pitchUm * UM) * TO_NH,
    inductiveSplitNh: inductiveSplitInductance(matrix) * TO_NH,
    formula:
      "Lᵢᵢ = 2e-7·l·[ln(2l/r) − c]; Lᵢⱼ = M(|i−j|·p), M(p) = 2e-7·l·[ln(l/p + √(1 + l²/p²)) − √(1 + p²/l²) + p/l]; " +
      "L = (Σᵢ Σⱼ Lᵢⱼ)/n² (equal currents); inductive split 1/(1ᵀL⁻¹1)",
  };
}
