import FFT from "fft.js";

/**
 * Fast Fourier transforms on separate real and imaginary arrays, computed by the `fft.js`
 * library (radix-4). Sizes must be powers of two; the refinement picks its grid so.
 * Forward: X[k] = Σ x[n]·e^(−2πikn/N); inverse divides by N.
 */

type Plan = { fft: FFT; input: number[]; output: number[] };
const plans = new Map<number, Plan>();

function planFor(n: number): Plan {
  let plan = plans.get(n);
  if (!plan) {
    const fft = new FFT(n);
    plan = { fft, input: fft.createComplexArray(), output: fft.createComplexArray() };
    plans.set(n, plan);
  }
  return plan;
}

/** 1-D FFT in place. */
export function fft1d(re: Float64Array, im: Float64Array, inverse = false): void {
  const n = re.length;
  if (n !== im.length || n === 0 || (n & (n - 1)) !== 0) throw new RangeError("FFT length must be a power of two");
  if (n === 1) return; // the DFT of one sample is that sample
  const { fft, input, output } = planFor(n);
  for (let i = 0; i < n; i++) {
    input[2 * i] = re[i];
    input[2 * i + 1] = im[i];
  }
  if (inverse) fft.inverseTransform(output, input);
  else fft.transform(output, input);
  for (let i = 0; i < n; i++) {
    re[i] = output[2 * i];
    im[i] = output[2 * i + 1];
  }
}

/** 2-D FFT of a row-major width × height array (rows, then columns), in place. */
export function fft2d(re: Float64Array, im: Float64Array, width: number, height: number, inverse = false): void {
  const rowRe = new Float64Array(width);
  const rowIm = new Float64Array(width);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    rowRe.set(re.subarray(o, o + width));
    rowIm.set(im.subarray(o, o + width));
    fft1d(rowRe, rowIm, inverse);
    re.set(rowRe, o);
    im.set(rowIm, o);
  }
  const colRe = new Float64Array(height);
  const colIm = new Float64Array(height);
  for (let x = 0; x < width; x++) {
    for (let y = 0; y < height; y++) {
      colRe[y] = re[y * width + x];
      colIm[y] = im[y * width + x];
    }
    fft1d(colRe, colIm, inverse);
    for (let y = 0; y < height; y++) {
      re[y * width + x] = colRe[y];
      im[y * width + x] = colIm[y];
    }
  }
}
