import { AlignmentInputError } from "./alignment-input-error";
import { solveAffine } from "./affine-fit";
import { solveSimilarity } from "./similarity";
import type { AlignmentOptions, AlignmentResult, ControlPointPair } from "./types";

export const ALIGNMENT_MODELS = ["similarity", "affine"] as const;
export type AlignmentModel = (typeof ALIGNMENT_MODELS)[number];

/** Fewest control-point pairs each model needs. */
export const MIN_PAIRS: Record<AlignmentModel, number> = { similarity: 2, affine: 3 };

/**
 * Throws AlignmentInputError naming the first control point whose image position lies off the
 * micrograph (continuous px: 0 ≤ x ≤ width, 0 ≤ y ≤ height). A point off the image cannot
 * have been clicked on a feature of it.
 */
export function checkInsideImage(pairs: readonly ControlPointPair[], widthPx: number, heightPx: number): void {
  pairs.forEach(({ imagePx: [x, y] }, i) => {
    if (!(x >= 0 && y >= 0 && x <= widthPx && y <= heightPx)) {
      throw new AlignmentInputError(`control point ${i + 1} (${x}, ${y}) lies outside the micrograph (${widthPx} × ${heightPx} px)`, [i]);
    }
  });
}

/** Fits the chosen model (similarity or affine) to the pairs; see solveSimilarity / solveAffine. */
export function fitAlignment(model: AlignmentModel, pairs: readonly ControlPointPair[], options: AlignmentOptions = {}): AlignmentResult {
  return model === "affine" ? solveAffine(pairs, options) : solveSimilarity(pairs, options);
}
