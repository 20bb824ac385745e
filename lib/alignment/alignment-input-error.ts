/** Control points that cannot determine the requested transform; the message says why. */
export class AlignmentInputError extends Error {
  /** Zero-based indices of the pairs at fault, when particular pairs are. */
  readonly pairIndices: readonly number[];

  constructor(message: string, pairIndices: readonly number[] = []) {
    super(message);
    this.name = "AlignmentInputError";
    this.pairIndices = pairIndices;
  }
}

/** Message for control points whose handedness contradicts the photo's mirrored setting. */
export function handednessMessage(mirrored: boolean): string {
  return mirrored
    ? "the control points fit an ordinary (not mirrored) photo; clear the mirrored option or check the pairs"
    : "the control points fit a mirrored photo; set the mirrored option if the photo is mirrored, or check the pairs";
}
