/**
 * Die economics: gross dies per wafer (Hennessy & Patterson) and die yield under the
 * classical defect models.
 */
import { requireNonNegative, requireOneOf, requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";

export const YIELD_MODELS = ["poisson", "murphy", "negative-binomial", "bose-einstein"] as const;
export type YieldModel = (typeof YIELD_MODELS)[number];

export type WaferInput = {
  waferDiameterMm: number;
  dieWidthMm: number;
  dieHeightMm: number;
  defectDensityPerCm2: number;
  /** Default negative-binomial. */
  model?: YieldModel;
  /** Clustering parameter α of the negative-binomial model (Hennessy & Patterson 4th ed.: 4). */
  alpha?: number;
  /** Exponent N of the Bose–Einstein form (Hennessy & Patterson 5th ed.: 13.5). */
  complexityFactor?: number;
};

export type WaferEstimate = EstimateMeta & {
  grossDies: number;
  yield: number;
  goodDies: number;
  /** Gross dies before rounding. */
  grossDiesExact: number;
  dieAreaCm2: number;
};

/**
 * Gross dies per wafer, DPW = π(d/2)²/A − π·d/√(2A), d and A in consistent units.
 * Hennessy & Patterson, Computer Architecture: A Quantitative Approach, 5th ed., §1.6.
 */
export function grossDiesPerWafer(waferDiameterCm: number, dieAreaCm2: number): number {
  return (Math.PI * (waferDiameterCm / 2) ** 2) / dieAreaCm2 - (Math.PI * waferDiameterCm) / Math.sqrt(2 * dieAreaCm2);
}

/**
 * Die yield for area A (cm²) and defect density D (/cm²):
 * Poisson e^(−AD); Murphy [(1 − e^(−AD))/(AD)]² (Proc. IEEE 52, 1964);
 * negative binomial (1 + AD/α)^(−α) (Stapper; H&P 4th ed.);
 * Bose–Einstein (1 + AD)^(−N) (Price, Proc. IEEE 58, 1970 — recalled; H&P 5th ed. form).
 */
export function dieYield(model: YieldModel, areaCm2: number, defectsPerCm2: number, alpha = 4, complexityFactor = 13.5): number {
  const ad = areaCm2 * defectsPerCm2;
  switch (model) {
    case "poisson":
      return Math.exp(-ad);
    case "murphy":
      // The limit AD → 0 is 1; -expm1 keeps digits for small AD.
      return ad === 0 ? 1 : (-Math.expm1(-ad) / ad) ** 2;
    case "negative-binomial":
      return Math.pow(1 + ad / alpha, -alpha);
    case "bose-einstein":
      return Math.pow(1 + ad, -complexityFactor);
  }
}

const FORMULAS: Record<YieldModel, string> = {
  poisson: "Y = e^(−A·D)",
  murphy: "Y = [(1 − e^(−A·D))/(A·D)]²",
  "negative-binomial": "Y = (1 + A·D/α)^(−α)",
  "bose-einstein": "Y = (1 + A·D)^(−N)",
};

/** Gross dies, die yield and good dies for a wafer (diameter and die size in mm). */
export function waferEstimate(input: WaferInput): WaferEstimate {
  const dCm = requirePositive("waferDiameterMm", input.waferDiameterMm) / 10;
  const wMm = requirePositive("dieWidthMm", input.dieWidthMm);
  const hMm = requirePositive("dieHeightMm", input.dieHeightMm);
  const density = requireNonNegative("defectDensityPerCm2", input.defectDensityPerCm2);
  const model = requireOneOf("model", input.model ?? "negative-binomial", YIELD_MODELS);
  const alpha = requirePositive("alpha", input.alpha ?? 4);
  const complexity = requirePositive("complexityFactor", input.complexityFactor ?? 13.5);
  const areaCm2 = (wMm * hMm) / 100;
  const exact = grossDiesPerWafer(dCm, areaCm2);
  const warnings: string[] = [];
  if (exact < 1) warnings.push("the die is too large for this wafer: no whole dies fit by this formula");
  if (Math.max(wMm, hMm) / Math.min(wMm, hMm) > 4) warnings.push("very elongated die: the dies-per-wafer formula assumes roughly square dies");
  // Hennessy & Patterson round to the nearest die (269.7 → 270 for their 1.5 cm example).
  const grossDies = Math.max(0, Math.round(exact));
  const y = dieYield(model, areaCm2, density, alpha, complexity);
  return {
    grossDies,
    yield: y,
    goodDies: Math.floor(grossDies * y),
    grossDiesExact: exact,
    dieAreaCm2: areaCm2,
    units: { grossDies: "dies", yield: "1", goodDies: "dies", grossDiesExact: "dies", dieAreaCm2: "cm²" },
    formula: `DPW = π(d/2)²/A − π·d/√(2A); ${FORMULAS[model]}; good dies = ⌊DPW·Y⌋`,
    source: "Hennessy & Patterson, Computer Architecture: A Quantitative Approach, 5th ed., §1.6; Murphy, Proc. IEEE 52(12), 1964; Stapper (negative binomial)",
    warnings,
  };
}
