export { MicrographViewer } from "./micrograph-viewer";
export type { MicrographSource } from "./micrograph-source";
export type { ViewerApi } from "./viewer-api";
export { CalibrationTool } from "./calibration-tool";
export { useViewVersion } from "./use-view-version";
export { usePointPicker } from "./use-point-picker";
