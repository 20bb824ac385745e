/**
 * Planar spiral inductors: Mohan, del Mar Hershenson, Boyd & Lee, "Simple accurate
 * expressions for planar spiral inductances", IEEE JSSC 34(10), 1999 — the modified Wheeler
 * expression and the current-sheet expression, both stated accurate to about 2–3 %.
 */
import { MU0, TO_NH, UM } from "./constants";
import { EstimateInputError, requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";

export type SpiralShape = "square" | "hexagonal" | "octagonal" | "circular";
export type SpiralMethod = "wheeler" | "current-sheet";

export type SpiralInput = {
  shape: SpiralShape;
  turns: number;
  outerDiameterUm: number;
  widthUm: number;
  spacingUm: number;
  /** Default current-sheet, the only one of the two with coefficients for every shape. */
  method?: SpiralMethod;
};

export type SpiralEstimate = EstimateMeta & {
  inductanceNh: number;
  innerDiameterUm: number;
  averageDiameterUm: number;
  fillRatio: number;
};

/** Mohan et al. 1999, Table I: K1, K2 (no circular entry). */
const WHEELER: Partial<Record<SpiralShape, [number, number]>> = {
  square: [2.34, 2.75],
  hexagonal: [2.33, 3.82],
  octagonal: [2.25, 3.55],
};

/** Mohan et al. 1999, Table II: c1, c2, c3, c4. */
const CURRENT_SHEET: Record<SpiralShape, [number, number, number, number]> = {
  square: [1.27, 2.07, 0.18, 0.13],
  hexagonal: [1.09, 2.23, 0, 0.17],
  octagonal: [1.07, 2.29, 0, 0.19],
  circular: [1.0, 2.46, 0, 0.2],
};

/** Modified Wheeler: L = K1·µ0·n²·d_avg/(1 + K2·ρ) (SI). */
function modifiedWheeler(shape: SpiralShape, n: number, dAvg: number, rho: number): number {
  const k = WHEELER[shape];
  if (!k) throw new EstimateInputError("method", "the modified Wheeler expression has no coefficients for circular spirals; use current-sheet");
  return (k[0] * MU0 * n * n * dAvg) / (1 + k[1] * rho);
}

/** Current sheet: L = µ0·n²·d_avg·c1/2·[ln(c2/ρ) + c3·ρ + c4·ρ²] (SI). */
function currentSheet(shape: SpiralShape, n: number, dAvg: number, rho: number): number {
  const [c1, c2, c3, c4] = CURRENT_SHEET[shape];
  return ((MU0 * n * n * dAvg * c1) / 2) * (Math.log(c2 / rho) + c3 * rho + c4 * rho * rho);
}

/**
 * Spiral inductance from turns, outer diameter, line width and spacing.
 * Inner diameter d_in = d_out − 2·n·w − 2·(n − 1)·s; d_avg = (d_out + d_in)/2;
 * fill ratio ρ = (d_out − d_in)/(d_out + d_in).
 */
export function spiralInductance(input: SpiralInput): SpiralEstimate {
  const turns = requirePositive("turns", input.turns);
  if (turns < 1) throw new EstimateInputError("turns", "turns must be at least 1");
  const dOut = requirePositive("outerDiameterUm", input.outerDiameterUm);
  const w = requirePositive("widthUm", input.widthUm);
  const s = requirePositive("spacingUm", input.spacingUm);
  const method = input.method ?? "current-sheet";
  const dIn = dOut - 2 * turns * w - 2 * (turns - 1) * s;
  if (dIn <= 0) {
    throw new EstimateInputError("outerDiameterUm", "outerDiameterUm is too small for these turns, widthUm and spacingUm (inner diameter ≤ 0)");
  }
  const dAvg = (dOut + dIn) / 2;
  const rho = (dOut - dIn) / (dOut + dIn);
  const henries = method === "wheeler" ? modifiedWheeler(input.shape, turns, dAvg * UM, rho) : currentSheet(input.shape, turns, dAvg * UM, rho);
  return {
    inductanceNh: henries * TO_NH,
    innerDiameterUm: dIn,
    averageDiameterUm: dAvg,
    fillRatio: rho,
    units: { inductanceNh: "nH", innerDiameterUm: "µm", averageDiameterUm: "µm", fillRatio: "1" },
    formula: method === "wheeler" ? "L = K1·µ0·n²·d_avg/(1 + K2·ρ) (modified Wheeler)" : "L = µ0·n²·d_avg·c1/2·[ln(c2/ρ) + c3·ρ + c4·ρ²] (current sheet)",
    source: "Mohan, del Mar Hershenson, Boyd & Lee, IEEE J. Solid-State Circuits 34(10), 1999",
    warnings: spiralWarnings(rho, w, s),
  };
}

/**
 * The ranges below are recalled from the paper, not re-read: its fits were judged on spirals
 * with moderate fill ratio and spacing no more than about three line widths.
 */
function spiralWarnings(rho: number, w: number, s: number): string[] {
  const warnings: string[] = [];
  if (rho < 0.1) warnings.push(`fill ratio ρ = ${rho.toFixed(3)} is very small (hollow spiral): accuracy not established below about 0.1`);
  if (rho > 0.8) warnings.push(`fill ratio ρ = ${rho.toFixed(3)} is very large (nearly full spiral): accuracy not established above about 0.8`);
  if (s > 3 * w) warnings.push("spacingUm exceeds 3·widthUm: the expressions lose accuracy for widely spaced turns");
  return warnings;
}
