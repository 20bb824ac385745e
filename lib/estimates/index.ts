/**
 * First-order electrical and economic estimates from die geometry. Pure functions; lengths in
 * µm at this edge, SI inside. `estimate(kind, params)` is what the API route calls.
 */
export { estimate, ESTIMATE_KINDS, type AnyEstimate, type EstimateKind } from "./dispatch";
export { EstimateInputError, requireInteger, requireNonNegative, requireOneOf, requirePermittivity, requirePositive } from "./input-error";
export type { EstimateMeta } from "./types";
export { agm, ellipticK, ellipticKRatio } from "./elliptic";
export { bondWireInductance, type BondWireEstimate, type BondWireInput } from "./bond-wire";
export { stripInductance, type StripEstimate, type StripInput } from "./strip";
export { currentSheet, modifiedWheeler, spiralInductance, type SpiralEstimate, type SpiralInput, type SpiralMethod, type SpiralShape } from "./spiral";
export { hammerstadJensen, microstripAnalysis, type MicrostripEstimate, type MicrostripInput } from "./microstrip";
export { microstripSynthesis, microstripWidthClosedForm, type MicrostripSynthesisEstimate, type MicrostripSynthesisInput } from "./microstrip-synthesis";
export { cpwImpedance, type CpwEstimate, type CpwInput } from "./cpw";
export { opticsEstimate, type OpticsEstimate, type OpticsInput } from "./optics";
export { dieYield, grossDiesPerWafer, waferEstimate, YIELD_MODELS, type WaferEstimate, type WaferInput, type YieldModel } from "./wafer";
export { SUBSTRATE_PRESETS, substratePreset, type SubstratePreset } from "./substrates";
