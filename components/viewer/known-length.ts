/** The outcome of reading a typed length: a number, or a message saying what is wrong. */
export type LengthParse = { ok: true; value: number } | { ok: false; message: string };

/**
 * Parses the known length typed for a calibration: a positive, finite number of µm.
 * A decimal comma is accepted because many lab notebooks use one.
 */
export function parseKnownLength(text: string): LengthParse {
  const t = text.trim().replace(",", ".");
  if (t === "") return { ok: false, message: "Enter the feature's known length in µm." };
  const value = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t) ? Number(t) : Number.NaN;
  if (!Number.isFinite(value)) return { ok: false, message: "The known length must be a number of µm, e.g. 250 or 12.5." };
  if (!(value > 0)) return { ok: false, message: "The known length must be greater than zero." };
  return { ok: true, value };
}
