/**
 * One entry point for the API route: kind + string query parameters → the right estimate.
 * Each reader below only converts strings and applies the documented defaults; range checks
 * live in the estimate functions themselves.
 */
import { bondWireInductance, type BondWireEstimate } from "./bond-wire";
import { cpwImpedance, type CpwEstimate } from "./cpw";
import { EstimateInputError } from "./input-error";
import { microstripAnalysis, type MicrostripEstimate } from "./microstrip";
import { microstripSynthesis, type MicrostripSynthesisEstimate } from "./microstrip-synthesis";
import { opticsEstimate, type OpticsEstimate } from "./optics";
import { booleanParam, enumParam, numberParam, optionalNumberParam, type QueryParams } from "./query-params";
import { spiralInductance, type SpiralEstimate } from "./spiral";
import { stripInductance, type StripEstimate } from "./strip";
import { waferEstimate, YIELD_MODELS, type WaferEstimate } from "./wafer";

export const ESTIMATE_KINDS = ["bond-wire", "strip", "spiral", "microstrip", "cpw", "optics", "wafer"] as const;
type EstimateKind = (typeof ESTIMATE_KINDS)[number];

export type AnyEstimate =
  BondWireEstimate | StripEstimate | SpiralEstimate | MicrostripEstimate | MicrostripSynthesisEstimate | CpwEstimate | OpticsEstimate | WaferEstimate;

/** Microstrip: widthUm → analysis; z0Ohm without widthUm → synthesis. */
function microstrip(p: QueryParams): MicrostripEstimate | MicrostripSynthesisEstimate {
  const common = {
    heightUm: numberParam(p, "heightUm"),
    er: numberParam(p, "er"),
    thicknessUm: numberParam(p, "thicknessUm", { default: 0, allowZero: true }),
  };
  const widthUm = optionalNumberParam(p, "widthUm");
  const z0Ohm = optionalNumberParam(p, "z0Ohm");
  if (widthUm !== undefined && z0Ohm !== undefined) {
    throw new EstimateInputError("z0Ohm", "give either widthUm (analysis) or z0Ohm (synthesis), not both");
  }
  if (widthUm !== undefined) return microstripAnalysis({ widthUm, ...common });
  if (z0Ohm !== undefined) return microstripSynthesis({ z0Ohm, ...common });
  throw new EstimateInputError("widthUm", "widthUm must be a positive number (or give z0Ohm to synthesise a width)");
}

const READERS: Record<EstimateKind, (p: QueryParams) => AnyEstimate> = {
  "bond-wire": (p) =>
    bondWireInductance({
      lengthUm: numberParam(p, "lengthUm"),
      diameterUm: numberParam(p, "diameterUm", { default: 25 }),
      count: numberParam(p, "count", { default: 1 }),
      pitchUm: optionalNumberParam(p, "pitchUm"),
      regime: enumParam(p, "regime", ["dc", "hf"] as const, "dc"),
    }),
  strip: (p) => stripInductance({ lengthUm: numberParam(p, "lengthUm"), widthUm: numberParam(p, "widthUm"), thicknessUm: numberParam(p, "thicknessUm") }),
  spiral: (p) =>
    spiralInductance({
      shape: enumParam(p, "shape", ["square", "hexagonal", "octagonal", "circular"] as const),
      turns: numberParam(p, "turns"),
      outerDiameterUm: numberParam(p, "outerDiameterUm"),
      widthUm: numberParam(p, "widthUm"),
      spacingUm: numberParam(p, "spacingUm"),
      method: enumParam(p, "method", ["wheeler", "current-sheet"] as const, "current-sheet"),
    }),
  microstrip,
  cpw: (p) =>
    cpwImpedance({
      widthUm: numberParam(p, "widthUm"),
      gapUm: numberParam(p, "gapUm"),
      er: numberParam(p, "er"),
      heightUm: optionalNumberParam(p, "heightUm"),
      backed: booleanParam(p, "backed", false),
    }),
  optics: (p) =>
    opticsEstimate({
      numericalAperture: numberParam(p, "numericalAperture"),
      wavelengthNm: numberParam(p, "wavelengthNm", { default: 550 }),
      cameraPixelPitchUm: numberParam(p, "cameraPixelPitchUm"),
      objectiveMag: numberParam(p, "objectiveMag"),
      adapterMag: numberParam(p, "adapterMag", { default: 1 }),
      refractiveIndex: numberParam(p, "refractiveIndex", { default: 1 }),
    }),
  wafer: (p) =>
    waferEstimate({
      waferDiameterMm: numberParam(p, "waferDiameterMm"),
      dieWidthMm: numberParam(p, "dieWidthMm"),
      dieHeightMm: numberParam(p, "dieHeightMm"),
      defectDensityPerCm2: numberParam(p, "defectDensityPerCm2", { allowZero: true }),
      model: enumParam(p, "model", YIELD_MODELS, "negative-binomial"),
      alpha: numberParam(p, "alpha", { default: 4 }),
      complexityFactor: numberParam(p, "complexityFactor", { default: 13.5 }),
    }),
};

/**
 * Runs the estimate `kind` on string query parameters (camelCase names, documented defaults).
 * Throws EstimateInputError naming the unknown kind or the bad/missing parameter.
 */
export function estimate(kind: string, params: QueryParams): AnyEstimate {
  if (!(ESTIMATE_KINDS as readonly string[]).includes(kind)) {
    throw new EstimateInputError("kind", `kind must be one of ${ESTIMATE_KINDS.join(", ")}`);
  }
  return READERS[kind as EstimateKind](params);
}
