import { describe, it, expect } from "vitest";
import { fft1d, fft2d } from "./fft";
import { seededRandom } from "./test-support";

/** The DFT straight from its definition X[k] = Σ x[n]·e^(−2πikn/N) (e.g. Oppenheim & Schafer, Discrete-Time Signal Processing, eq. 8.67). */
function naiveDft(re: number[], im: number[]) {
  const n = re.length;
  const outRe: number[] = [];
  const outIm: number[] = [];
  for (let k = 0; k < n; k++) {
    let sr = 0;
    let si = 0;
    for (let t = 0; t < n; t++) {
      const a = (-2 * Math.PI * k * t) / n;
      sr += re[t] * Math.cos(a) - im[t] * Math.sin(a);
      si += re[t] * Math.sin(a) + im[t] * Math.cos(a);
    }
    outRe.push(sr);
    outIm.push(si);
  }
  return { outRe, outIm };
}

describe("fft1d", () => {
  it("matches the DFT definition on 64 random complex samples", () => {
    const rnd = seededRandom(3);
    const re = Array.from({ length: 64 }, () => rnd() - 0.5);
    const im = Array.from({ length: 64 }, () => rnd() - 0.5);
    const { outRe, outIm } = naiveDft(re, im);
    const a = Float64Array.from(re);
    const b = Float64Array.from(im);
    fft1d(a, b);
    outRe.forEach((v, k) => expect(a[k]).toBeCloseTo(v, 10));
    outIm.forEach((v, k) => expect(b[k]).toBeCloseTo(v, 10));
  });

  it("matches the DFT definition forward and back on sizes 1 to 512 (radix-4 and odd powers of two)", () => {
    const rnd = seededRandom(11);
    for (const n of [1, 2, 4, 8, 32, 128, 512]) {
      const re = Array.from({ length: n }, () => rnd() - 0.5);
      const im = Array.from({ length: n }, () => rnd() - 0.5);
      const { outRe, outIm } = naiveDft(re, im);
      const a = Float64Array.from(re);
      const b = Float64Array.from(im);
      fft1d(a, b);
      const tol = 1e-9 * n;
      outRe.forEach((v, k) => expect(Math.abs(a[k] - v), `n=${n} re[${k}]`).toBeLessThan(tol));
      outIm.forEach((v, k) => expect(Math.abs(b[k] - v), `n=${n} im[${k}]`).toBeLessThan(tol));
      fft1d(a, b, true); // the inverse DFT, x[n] = (1/N)·Σ X[k]·e^(+2πikn/N), gives the samples back
      re.forEach((v, k) => expect(a[k]).toBeCloseTo(v, 12));
      im.forEach((v, k) => expect(b[k]).toBeCloseTo(v, 12));
    }
  });

  it("transforms a unit impulse to all ones and back (DFT definition)", () => {
    const re = new Float64Array(8);
    const im = new Float64Array(8);
    re[0] = 1;
    fft1d(re, im);
    expect(Array.from(re)).toEqual(new Array(8).fill(1));
    fft1d(re, im, true);
    expect(re[0]).toBeCloseTo(1, 14);
    expect(Math.max(...Array.from(re.subarray(1)).map(Math.abs))).toBeLessThan(1e-15);
  });

  it("refuses lengths that are not powers of two", () => {
    expect(() => fft1d(new Float64Array(6), new Float64Array(6))).toThrow(/power of two/);
  });
});

describe("fft2d", () => {
  it("puts a 2-D cosine's energy in its two frequency bins (DFT definition)", () => {
    const w = 16;
    const h = 8;
    const re = new Float64Array(w * h);
    const im = new Float64Array(w * h);
    for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) re[y * w + x] = Math.cos(2 * Math.PI * ((3 * x) / w + (2 * y) / h));
    fft2d(re, im, w, h);
    // cos(2π(kx/W + ly/H)) = ½(e^{+…} + e^{−…}): W·H/2 at (3, 2) and at (W−3, H−2).
    expect(re[2 * w + 3]).toBeCloseTo((w * h) / 2, 9);
    expect(re[(h - 2) * w + (w - 3)]).toBeCloseTo((w * h) / 2, 9);
    let rest = 0;
    re.forEach((v, i) => {
      if (i !== 2 * w + 3 && i !== (h - 2) * w + (w - 3)) rest = Math.max(rest, Math.abs(v));
    });
    expect(rest).toBeLessThan(1e-9);
  });
});
