/**
 * First-order electrical and economic estimates from die geometry. Pure functions; lengths in
 * µm at this edge, SI inside. `estimate(kind, params)` is what the API route calls.
 */
export { estimate, ESTIMATE_KINDS } from "./dispatch";
export { EstimateInputError } from "./input-error";
export type { EstimateMeta } from "./types";
export { bondWireInductance } from "./bond-wire";
export { stripInductance } from "./strip";
export { spiralInductance, type SpiralMethod, type SpiralShape } from "./spiral";
export { microstripAnalysis } from "./microstrip";
export { cpwImpedance } from "./cpw";
export { waferEstimate, YIELD_MODELS, type YieldModel } from "./wafer";
export { SUBSTRATE_PRESETS } from "./substrates";
