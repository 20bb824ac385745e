import { fft2d } from "./fft";

/** A measured shift between two equally sized images. */
export type Shift = {
  /** Shift d in px such that moving(x) ≈ reference(x − d): the moving image is the reference moved by d. */
  readonly dx: number;
  readonly dy: number;
  /** Height of the correlation peak (1 for a perfect circular shift, near 0 for no match). */
  readonly peak: number;
};

/** Hann window weights, which keep the image borders from dominating the spectrum. */
function hann(n: number): Float64Array {
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / (n - 1 || 1));
  return w;
}

function windowed(img: Float64Array, width: number, height: number, wx: Float64Array, wy: Float64Array): Float64Array {
  let mean = 0;
  for (const v of img) mean += v;
  mean /= img.length;
  const out = new Float64Array(img.length);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) out[y * width + x] = (img[y * width + x] - mean) * wx[x] * wy[y];
  return out;
}

/** Sub-pixel offset of a peak from three samples by fitting a parabola (common practice). */
function parabolic(left: number, centre: number, right: number): number {
  const denom = left - 2 * centre + right;
  return denom < 0 ? Math.max(-0.5, Math.min(0.5, (left - right) / (2 * denom))) : 0;
}

/**
 * Phase correlation (Kuglin & Hudson, Proc. IEEE Int. Conf. Cybernetics and Society, 1975):
 * the normalised cross-power spectrum A·B̄/|A·B̄| of two images transforms back to a peak at
 * their relative shift. Images are row-major, width and height powers of two. Shifts are
 * found within ±half the size; a parabola through the peak's neighbours gives sub-pixel values.
 */
export function phaseCorrelate(reference: Float64Array, moving: Float64Array, width: number, height: number, options: { window?: boolean } = {}): Shift {
  if (reference.length !== width * height || moving.length !== width * height) throw new RangeError("images must be width × height");
  const useWindow = options.window ?? true;
  const [wx, wy] = useWindow ? [hann(width), hann(height)] : [new Float64Array(width).fill(1), new Float64Array(height).fill(1)];
  const aRe = windowed(reference, width, height, wx, wy);
  const bRe = windowed(moving, width, height, wx, wy);
  const aIm = new Float64Array(aRe.length);
  const bIm = new Float64Array(bRe.length);
  fft2d(aRe, aIm, width, height);
  fft2d(bRe, bIm, width, height);
  for (let i = 0; i < aRe.length; i++) {
    // A·conj(B), normalised to unit magnitude.
    const re = aRe[i] * bRe[i] + aIm[i] * bIm[i];
    const im = aIm[i] * bRe[i] - aRe[i] * bIm[i];
    const mag = Math.hypot(re, im);
    aRe[i] = mag > 1e-12 ? re / mag : 0;
    aIm[i] = mag > 1e-12 ? im / mag : 0;
  }
  fft2d(aRe, aIm, width, height, true);
  let best = 0;
  for (let i = 1; i < aRe.length; i++) if (aRe[i] > aRe[best]) best = i;
  const px = best % width;
  const py = Math.floor(best / width);
  const at = (x: number, y: number) => aRe[((y + height) % height) * width + ((x + width) % width)];
  const fx = px + parabolic(at(px - 1, py), at(px, py), at(px + 1, py));
  const fy = py + parabolic(at(px, py - 1), at(px, py), at(px, py + 1));
  // The peak sits at −d (mod size): wrap into [−size/2, size/2).
  const wrap = (v: number, n: number) => ((((-v + n / 2) % n) + n) % n) - n / 2;
  return { dx: wrap(fx, width), dy: wrap(fy, height), peak: aRe[best] };
}
