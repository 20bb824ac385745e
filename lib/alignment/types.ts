import type { Affine2x3 } from "../geometry/types";

/** One control point: the same feature clicked in a micrograph (px) and in the die frame (µm). */
export type ControlPointPair = {
  readonly imagePx: readonly [number, number];
  readonly dieUm: readonly [number, number];
};

export type AlignmentOptions = {
  /**
   * The photo really is mirrored (e.g. taken through the substrate from the back side), so the
   * image→die transform keeps handedness instead of flipping it. Default false.
   */
  readonly mirrored?: boolean;
};

/** A fitted image px → die µm transform and how well each control point agrees with it. */
export type AlignmentResult = {
  readonly transform: Affine2x3;
  /** Per pair, the distance in die µm between the mapped image point and the given die point. */
  readonly residualsUm: number[];
  /** Root mean square of the residuals, in die µm. */
  readonly rmsUm: number;
  /** Index of the pair with the largest residual (the first one on ties). */
  readonly worstIndex: number;
};
