/** Histogram of deviations for the report's chart. */

export type HistogramBin = { readonly fromUm: number; readonly toUm: number; readonly count: number };

/**
 * Splits [min(0, smallest), largest] into binCount equal bins; each bin holds values in
 * [fromUm, toUm), the last one also its upper edge. Non-finite values are skipped. With no
 * spread (or no values) the range is one unit wide so the bins stay drawable.
 */
export function deviationHistogram(values: readonly number[], binCount: number): HistogramBin[] {
  if (!Number.isInteger(binCount) || binCount < 1 || binCount > 10_000) {
    throw new RangeError("binCount must be a whole number from 1 to 10000");
  }
  const finite = values.filter(Number.isFinite);
  // reduce, not Math.min(...values): spreading a long array overflows the call stack.
  const lo = finite.reduce((m, v) => Math.min(m, v), 0);
  const top = finite.reduce((m, v) => Math.max(m, v), lo);
  const hi = top > lo ? top : lo + 1;
  const width = (hi - lo) / binCount;
  const counts = new Array<number>(binCount).fill(0);
  for (const v of finite) counts[Math.min(binCount - 1, Math.floor((v - lo) / width))]++;
  return counts.map((count, i) => ({ fromUm: lo + i * width, toUm: i === binCount - 1 ? hi : lo + (i + 1) * width, count }));
}

/**
 * Decimals for the ends of a histogram axis from `lo` to `hi`: enough that one unit of the last
 * digit is at most a tenth of the span, so both ends read as different numbers (0.000 … 0.030
 * rather than 0.0 … 0.0), from 0 up to 6.
 */
export function axisDecimals(lo: number, hi: number): number {
  const span = Math.abs(hi - lo);
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  return Math.min(6, Math.max(0, Math.ceil(-Math.log10(span) - 1e-9) + 1));
}
