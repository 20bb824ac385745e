import { fft2d } from "@/lib/alignment/fft";
import type { GreyPatch } from "./patch";

/** One candidate shift from the phase correlation surface: moving(u) ≈ reference(u − d). */
export type CorrelationPeak = { dx: number; dy: number; value: number; periodX: number; periodY: number };

const nextPow2 = (n: number) => 2 ** Math.ceil(Math.log2(Math.max(2, n)));

function hann(n: number): Float64Array {
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * (i + 0.5)) / n);
  return w;
}

/** Mean-free, Hann-windowed copy of an image zero-padded to a power-of-two grid. */
function windowedPadded(img: Float32Array, width: number, height: number, pw: number, ph: number): Float64Array {
  let mean = 0;
  for (let i = 0; i < img.length; i++) mean += img[i];
  mean /= img.length || 1;
  const wx = hann(width);
  const wy = hann(height);
  const out = new Float64Array(pw * ph);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) out[y * pw + x] = (img[y * width + x] - mean) * wx[x] * wy[y];
  return out;
}

/** Sub-pixel offset of a peak from three samples by fitting a parabola through them. */
export function parabolicOffset(left: number, centre: number, right: number): number {
  const denom = left - 2 * centre + right;
  return denom < 0 ? Math.max(-0.5, Math.min(0.5, (left - right) / (2 * denom))) : 0;
}

/**
 * Phase correlation (Kuglin & Hines, Proc. IEEE Int. Conf. Cybernetics and Society, 1975):
 * the inverse transform of the normalised cross-power spectrum of two equally sized images
 * peaks at their relative shift. The images are windowed (Hann) against edge effects and
 * zero-padded to powers of two (fft.js). A shift is only known modulo the padded size, so the
 * `count` highest local maxima are returned with that period; the caller picks among the
 * aliases by normalised cross-correlation of the real overlaps (Chalfoun et al., Sci. Rep.
 * 7:4988, 2017).
 */
export function phaseCorrelationPeaks(reference: Float32Array, moving: Float32Array, width: number, height: number, count = 3): CorrelationPeak[] {
  const pw = nextPow2(width);
  const ph = nextPow2(height);
  const aRe = windowedPadded(reference, width, height, pw, ph);
  const bRe = windowedPadded(moving, width, height, pw, ph);
  const aIm = new Float64Array(aRe.length);
  const bIm = new Float64Array(bRe.length);
  fft2d(aRe, aIm, pw, ph);
  fft2d(bRe, bIm, pw, ph);
  for (let i = 0; i < aRe.length; i++) {
    const re = aRe[i] * bRe[i] + aIm[i] * bIm[i];
    const im = aIm[i] * bRe[i] - aRe[i] * bIm[i];
    const mag = Math.hypot(re, im);
    aRe[i] = mag > 1e-12 ? re / mag : 0;
    aIm[i] = mag > 1e-12 ? im / mag : 0;
  }
  fft2d(aRe, aIm, pw, ph, true);
  const at = (x: number, y: number) => aRe[((y + ph) % ph) * pw + ((x + pw) % pw)];
  const maxima: { i: number; v: number }[] = [];
  for (let y = 0; y < ph; y++) {
    for (let x = 0; x < pw; x++) {
      const v = aRe[y * pw + x];
      if (maxima.length === count && v <= maxima[count - 1].v) continue;
      if (v < at(x - 1, y) || v < at(x + 1, y) || v < at(x, y - 1) || v < at(x, y + 1)) continue;
      maxima.push({ i: y * pw + x, v });
      maxima.sort((p, q) => q.v - p.v);
      if (maxima.length > count) maxima.pop();
    }
  }
  // The peak of reference ⋆ moving sits at −d (mod size).
  const wrap = (v: number, n: number) => ((((-v + n / 2) % n) + n) % n) - n / 2;
  return maxima.map(({ i, v }) => {
    const px = i % pw;
    const py = Math.floor(i / pw);
    const fx = px + parabolicOffset(at(px - 1, py), v, at(px + 1, py));
    const fy = py + parabolicOffset(at(px, py - 1), v, at(px, py + 1));
    return { dx: wrap(fx, pw), dy: wrap(fy, ph), value: v, periodX: pw, periodY: ph };
  });
}

/** Normalised cross-correlation of two patches' overlap, and how many pixels it covered. */
export type Overlap = { ncc: number; pixels: number };

/**
 * Pearson correlation of frame a's and frame b's pixels that coincide when b's top-left sits
 * at a's top-left + (tx, ty) (integers): b(v) is compared with a(v + t) over the part both
 * patches hold (every `rowStep`-th row of it). Insensitive to a gain and offset between the
 * frames.
 */
export function overlapNcc(a: GreyPatch, b: GreyPatch, tx: number, ty: number, rowStep = 1): Overlap {
  const vx0 = Math.max(b.x0, a.x0 - tx);
  const vy0 = Math.max(b.y0, a.y0 - ty);
  const vx1 = Math.min(b.x0 + b.width, a.x0 + a.width - tx);
  const vy1 = Math.min(b.y0 + b.height, a.y0 + a.height - ty);
  const w = vx1 - vx0;
  const h = vy1 - vy0;
  if (w <= 0 || h <= 0) return { ncc: -1, pixels: 0 };
  let sa = 0;
  let sb = 0;
  let saa = 0;
  let sbb = 0;
  let sab = 0;
  const ad = a.data;
  const bd = b.data;
  let n = 0;
  for (let y = 0; y < h; y += rowStep) {
    n += w;
    let ia = (vy0 + y + ty - a.y0) * a.width + (vx0 + tx - a.x0);
    let ib = (vy0 + y - b.y0) * b.width + (vx0 - b.x0);
    for (let x = 0; x < w; x++, ia++, ib++) {
      const p = ad[ia];
      const q = bd[ib];
      sa += p;
      sb += q;
      saa += p * p;
      sbb += q * q;
      sab += p * q;
    }
  }
  const va = saa - (sa * sa) / n;
  const vb = sbb - (sb * sb) / n;
  const cov = sab - (sa * sb) / n;
  const ncc = va > 1e-9 && vb > 1e-9 ? cov / Math.sqrt(va * vb) : 0;
  return { ncc, pixels: w * h };
}

/** Below this rms of high-passed pixels (grey levels) an overlap counts as blank. */
const EDGE_FLOOR = 0.5;

/**
 * NCC of the two overlaps after a high-pass filter (each pixel minus the mean of its right and
 * lower neighbours): shading, vignetting and brightness are smooth and drop out, so a blank
 * overlap scores about 0 however its illumination varies, while real structure scores high.
 * Used to decide whether a measured translation can be trusted. An overlap whose high-passed
 * pixels vary by less than EDGE_FLOOR (rms, grey levels) on either side scores 0: what is left
 * there is the slope of a smooth shading, the same at every shift, not structure.
 */
export function overlapEdgeNcc(a: GreyPatch, b: GreyPatch, tx: number, ty: number): Overlap {
  const vx0 = Math.max(b.x0, a.x0 - tx);
  const vy0 = Math.max(b.y0, a.y0 - ty);
  const w = Math.min(b.x0 + b.width, a.x0 + a.width - tx) - vx0 - 1;
  const h = Math.min(b.y0 + b.height, a.y0 + a.height - ty) - vy0 - 1;
  if (w <= 0 || h <= 0) return { ncc: -1, pixels: 0 };
  let sa = 0;
  let sb = 0;
  let saa = 0;
  let sbb = 0;
  let sab = 0;
  const ad = a.data;
  const bd = b.data;
  for (let y = 0; y < h; y++) {
    let ia = (vy0 + y + ty - a.y0) * a.width + (vx0 + tx - a.x0);
    let ib = (vy0 + y - b.y0) * b.width + (vx0 - b.x0);
    for (let x = 0; x < w; x++, ia++, ib++) {
      const p = 2 * ad[ia] - ad[ia + 1] - ad[ia + a.width];
      const q = 2 * bd[ib] - bd[ib + 1] - bd[ib + b.width];
      sa += p;
      sb += q;
      saa += p * p;
      sbb += q * q;
      sab += p * q;
    }
  }
  const n = w * h;
  const va = saa - (sa * sa) / n;
  const vb = sbb - (sb * sb) / n;
  const cov = sab - (sa * sb) / n;
  const floor = n * EDGE_FLOOR * EDGE_FLOOR;
  return { ncc: va > floor && vb > floor ? cov / Math.sqrt(va * vb) : 0, pixels: n };
}
