/**
 * What every estimate returns besides its numbers: the unit of each number, the formula in
 * plain text, where it is published, and warnings when the input lies outside the range the
 * source states (the numbers are still returned).
 */
export type EstimateMeta = {
  /** Unit of each returned number, keyed by the number's name. */
  readonly units: Readonly<Record<string, string>>;
  readonly formula: string;
  readonly source: string;
  readonly warnings: string[];
};
