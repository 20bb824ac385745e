/**
 * Symmetry of a layout about an axis: mirror images, optimal mirror partners and their
 * deviations. Pure functions on die-µm geometry.
 */
export { symmetryReport } from "./report";
export { mirrorGeometry, reflectPoint, signedDistance, axisLine, type AxisLine } from "./reflect";
export { axisDecimals, deviationHistogram, type HistogramBin } from "./histogram";
export { shapeCentre, boundingBox, pathLength } from "./shape-metrics";
export {
  SYMMETRY_KINDS,
  SymmetryInputError,
  type SizeDifference,
  type SymmetryAxis,
  type SymmetryKind,
  type SymmetryOptions,
  type SymmetryPair,
  type SymmetryReport,
  type SymmetryShape,
  type UnmatchedShape,
  type Vector,
} from "./types";
