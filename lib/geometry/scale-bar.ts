/** A scale bar: its length in die µm, its length on screen, and the text printed beside it. */
export type ScaleBar = { readonly lengthUm: number; readonly px: number; readonly label: string };

// The 1-2-5 sequence of round numbers per decade is the usual choice for scale bars and
// instrument ranges (common practice).
const MANTISSAS = [5, 2, 1] as const;

/** m · 10^e computed so that negative decades stay exact-looking (5 / 10, not 5 · 0.1). */
function scaled(m: number, e: number): number {
  return e >= 0 ? m * 10 ** e : m / 10 ** -e;
}

/** Text for m · 10^e µm in nm below 1 µm, µm below 1 mm, mm from there (SI prefixes). */
function labelFor(m: number, e: number): string {
  const unit = e < 0 ? { name: "nm", shift: -3 } : e < 3 ? { name: "µm", shift: 0 } : { name: "mm", shift: 3 };
  const exponent = e - unit.shift;
  const digits = Math.max(0, -exponent);
  return `${scaled(m, exponent).toFixed(digits)} ${unit.name}`;
}

/**
 * The longest 1, 2 or 5 × 10^n µm length whose bar fits in targetPx on screen.
 * @param umPerScreenPx die µm covered by one CSS pixel at the current zoom
 * @param targetPx the longest bar the layout allows
 */
export function niceScaleBarLength(umPerScreenPx: number, targetPx: number): ScaleBar {
  if (!(umPerScreenPx > 0) || !Number.isFinite(umPerScreenPx)) throw new RangeError("umPerScreenPx must be a positive number");
  if (!(targetPx > 0) || !Number.isFinite(targetPx)) throw new RangeError("targetPx must be a positive number");
  const maxUm = umPerScreenPx * targetPx;
  const top = Math.floor(Math.log10(maxUm)) + 1;
  // Start one decade above the logarithm's guess so rounding in log10 cannot skip a fit.
  for (let e = top; e >= top - 2; e--) {
    for (const m of MANTISSAS) {
      const lengthUm = scaled(m, e);
      const px = lengthUm / umPerScreenPx;
      if (px <= targetPx * (1 + 1e-12)) return { lengthUm, px, label: labelFor(m, e) };
    }
  }
  throw new RangeError("no scale bar length fits");
}
