// Shapes of what the API answers; the server builds them, client components read them.
import type { TeamRole } from "@/lib/auth/permissions";
import type { Illumination, MicrographStatus } from "@/lib/dto/stored-values";
import type { Transform } from "@/lib/geometry/types";

/** A two-point scale calibration: two image points a known length apart. */
export type ScaleCalibration = { p1: [number, number]; p2: [number, number]; lengthUm: number };

export type MicrographDto = {
  id: string;
  dieId: string;
  label: string;
  status: MicrographStatus;
  progress: number;
  width: number | null;
  height: number | null;
  scaleUmPerPx: number | null;
  illumination: Illumination;
  objectiveMag: number | null;
  numericalAperture: number | null;
  cameraPixelPitchUm: number | null;
  adapterMag: number | null;
  transform: Transform | null;
  isReference: boolean;
  calibration: ScaleCalibration | null;
  format: string | null;
  bytes: number | null;
  previewWidth: number | null;
  previewHeight: number | null;
  position: number;
  error?: string;
  /** The grid and its registration when the micrograph was stitched from frames; null otherwise. */
  mosaic: MosaicDto | null;
  yourRole: TeamRole;
  createdAt: string;
  updatedAt: string;
};

/** Where a mosaic's job is: the stitch stages, then the ordinary tiling, then done (or failed). */
export type MosaicStage = "checking" | "registering" | "placing" | "composing" | "tiling" | "done" | "failed";

/** One frame of a mosaic: its grid cell and its top-left corner in mosaic px. */
export type MosaicFrameDto = { index: number; row: number; col: number; x: number; y: number };
/** One pair of neighbouring frames: the translation of b relative to a, its correlation peak, and whether it was measured or taken from the stage model. */
export type MosaicPairDto = { a: number; b: number; dx: number; dy: number; peak: number; used: "measured" | "stage_model" };

export type MosaicDto = {
  rows: number;
  cols: number;
  order: "rows" | "serpentine";
  frameWidth: number;
  frameHeight: number;
  /** Empty until the frames are placed. */
  frames: MosaicFrameDto[];
  pairs: MosaicPairDto[];
  /** Null until placed. */
  residualPx: { rms: number; max: number } | null;
  overlapPercent: number;
  flatField: boolean;
  stage: MosaicStage;
  /** Progress within the stage, 0–100. */
  stageProgress: number;
  warnings: string[];
  /** A new stitch (other overlap or order) under way while the previous result stays served. */
  restitching: boolean;
};
