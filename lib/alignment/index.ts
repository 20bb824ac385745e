export { AlignmentInputError } from "./alignment-input-error";
export { alignmentResiduals } from "./residuals";
export type { AlignmentResult, ControlPointPair } from "./types";
