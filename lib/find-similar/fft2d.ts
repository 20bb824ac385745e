import FFT from "fft.js";

/**
 * Two-dimensional discrete Fourier transform by rows then columns (the row–column method) on
 * fft.js's one-dimensional radix-4 transform. Data are interleaved complex numbers, row-major,
 * both sides powers of two. The inverse includes the 1/N scaling (fft.js scales each 1-D pass).
 */

const plans = new Map<number, FFT>();
function plan(n: number): FFT {
  let p = plans.get(n);
  if (!p) {
    p = new FFT(n);
    plans.set(n, p);
  }
  return p;
}

/** The smallest power of two ≥ n (and ≥ 2, the least size fft.js accepts). */
export function nextPow2(n: number): number {
  let p = 2;
  while (p < n) p *= 2;
  return p;
}

/** In-place 2-D transform of `data` (length 2·w·h). */
export function fft2d(data: Float64Array, w: number, h: number, inverse: boolean): void {
  const rowPlan = plan(w);
  const colPlan = plan(h);
  const rowOut = new Float64Array(2 * w);
  for (let r = 0; r < h; r++) {
    const row = data.subarray(2 * w * r, 2 * w * (r + 1));
    if (inverse) rowPlan.inverseTransform(rowOut, row);
    else rowPlan.transform(rowOut, row);
    row.set(rowOut);
  }
  const col = new Float64Array(2 * h);
  const colOut = new Float64Array(2 * h);
  for (let c = 0; c < w; c++) {
    for (let r = 0, i = 2 * c; r < h; r++, i += 2 * w) {
      col[2 * r] = data[i];
      col[2 * r + 1] = data[i + 1];
    }
    if (inverse) colPlan.inverseTransform(colOut, col);
    else colPlan.transform(colOut, col);
    for (let r = 0, i = 2 * c; r < h; r++, i += 2 * w) {
      data[i] = colOut[2 * r];
      data[i + 1] = colOut[2 * r + 1];
    }
  }
}
