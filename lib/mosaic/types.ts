import type { CaptureOrder } from "./grid";

/** One frame's place in the stitched mosaic: its top-left corner in mosaic px (integers). */
export type MosaicFrame = { index: number; row: number; col: number; x: number; y: number };

/**
 * The translation between two neighbouring frames: b's top-left minus a's, in px (a, b are
 * frame indexes in capture order). `peak` is the normalised cross-correlation of the two
 * frames' high-passed overlaps at that translation (1 = identical, about 0 = blank or
 * unrelated). `used` says
 * whether the measured translation was kept or replaced by the stage model.
 */
export type MosaicPair = { a: number; b: number; dx: number; dy: number; peak: number; used: "measured" | "stage_model" };

/** What stitching found: the placement of every frame, the pair measurements and their fit. */
export type MosaicLayout = {
  rows: number;
  cols: number;
  order: CaptureOrder;
  frameWidth: number;
  frameHeight: number;
  width: number;
  height: number;
  frames: MosaicFrame[];
  pairs: MosaicPair[];
  /** Disagreement between the measured pair translations and the placement, in px. */
  residualPx: { rms: number; max: number };
  warnings: string[];
};

export type StitchStage = "registering" | "placing" | "composing";
