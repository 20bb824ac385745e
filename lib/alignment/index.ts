export { AlignmentInputError } from "./alignment-input-error";
export { solveAffine } from "./affine-fit";
export { alignmentResiduals } from "./residuals";
export { solveSimilarity } from "./similarity";
export type { AlignmentOptions, AlignmentResult, ControlPointPair } from "./types";
