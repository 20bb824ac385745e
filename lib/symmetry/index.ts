/**
 * Symmetry of a layout about an axis: mirror images, optimal mirror partners and their
 * deviations. Pure functions on die-µm geometry.
 */
export { symmetryReport } from "./report";
export { mirrorGeometry, axisLine } from "./reflect";
export { axisDecimals, deviationHistogram } from "./histogram";
export { SymmetryInputError, type SymmetryPair, type SymmetryReport, type SymmetryShape } from "./types";
