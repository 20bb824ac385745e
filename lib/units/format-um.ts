/**
 * Lengths in die µm shown to people (UI, CSV, GeoJSON, PDF, PNG labels).
 *
 * A value is given as many decimals as the image scale resolves: one unit of the last digit is no
 * larger than one pixel (0.45 µm/px → 1 decimal, 1.33 µm/px → 0, 0.05 µm/px → 2). Without a known
 * scale, 2 decimals. Float noise from frame arithmetic (2393.9998965514333) disappears.
 */
const DEFAULT_UM_DECIMALS = 2;
const MAX_UM_DECIMALS = 4;

/** Decimals that a scale of `umPerPx` µm per pixel supports. */
export function umDecimals(umPerPx?: number | null): number {
  if (umPerPx == null || !Number.isFinite(umPerPx) || umPerPx <= 0) return DEFAULT_UM_DECIMALS;
  const d = Math.ceil(-Math.log10(umPerPx) - 1e-9);
  return Math.min(MAX_UM_DECIMALS, Math.max(0, d));
}

/** The value rounded to the decimals the scale supports, as a number (for CSV and GeoJSON). */
export function roundUm(valueUm: number, umPerPx?: number | null): number {
  const d = umDecimals(umPerPx);
  const f = 10 ** d;
  const r = Math.round(valueUm * f) / f;
  return Object.is(r, -0) ? 0 : r;
}

/** The value as text with its decimals, without the unit ("2394", "12.5"). */
export function formatUm(valueUm: number, umPerPx?: number | null): string {
  return roundUm(valueUm, umPerPx).toFixed(umDecimals(umPerPx));
}
