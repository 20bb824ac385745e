import { fft2d, nextPow2 } from "./fft2d";
import type { Gray } from "./types";

/**
 * Zero-mean normalized cross-correlation of a template over an image, the fast way of J. P.
 * Lewis, "Fast Normalized Cross-Correlation" (Vision Interface 1995): the numerator
 * Σ f(x+u)·(t(x) − t̄) is a correlation with a zero-mean template, computed for every offset u at
 * once through the FFT; the image's local energy Σ f² − (Σ f)²/N under each window comes from
 * running-sum (summed-area) tables. The values are those of OpenCV's `matchTemplate` with
 * `TM_CCOEFF_NORMED`, including its handling of flat windows (score 0) and of a flat template
 * (score 1 everywhere).
 *
 * Since the image and templates are real, two templates share one inverse transform: with
 * g = t₁ + i·t₂ the spectrum F(k)·G(−k) transforms back to c₁ + i·c₂.
 */

/** Sum tables of an image: sum and sum of squares over [0, x) × [0, y), (W+1)·(H+1) entries. */
type SumTables = { s1: Float64Array; s2: Float64Array };

function sumTables(img: Gray, offset: number): SumTables {
  const { width: w, height: h, data } = img;
  const stride = w + 1;
  const s1 = new Float64Array(stride * (h + 1));
  const s2 = new Float64Array(stride * (h + 1));
  for (let y = 0; y < h; y++) {
    let r1 = 0;
    let r2 = 0;
    for (let x = 0; x < w; x++) {
      const v = data[y * w + x] - offset;
      r1 += v;
      r2 += v * v;
      const i = (y + 1) * stride + x + 1;
      s1[i] = s1[i - stride] + r1;
      s2[i] = s2[i - stride] + r2;
    }
  }
  return { s1, s2 };
}

function zeroMean(t: Gray): { data: Float64Array; norm: number } {
  const n = t.width * t.height;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += t.data[i];
  mean /= n;
  const data = new Float64Array(n);
  let energy = 0;
  for (let i = 0; i < n; i++) {
    data[i] = t.data[i] - mean;
    energy += data[i] * data[i];
  }
  return { data, norm: Math.sqrt(energy) };
}

/** The image side of the correlation, computed once and reused for every template variant. */
export class ZnccPlan {
  readonly width: number;
  readonly height: number;
  private readonly pw: number;
  private readonly ph: number;
  private readonly spectrum: Float64Array;
  private readonly sums: SumTables;

  constructor(image: Gray) {
    const { width: w, height: h, data } = image;
    if (w < 1 || h < 1 || data.length !== w * h) throw new RangeError("image size does not match its data");
    this.width = w;
    this.height = h;
    // The correlation for offsets 0 … W − w never wraps when the transform is at least W wide.
    this.pw = nextPow2(w);
    this.ph = nextPow2(h);
    let mean = 0;
    for (let i = 0; i < data.length; i++) mean += data[i];
    mean /= data.length;
    // The global mean is subtracted for precision only: it changes neither numerator nor energy.
    const spec = new Float64Array(2 * this.pw * this.ph);
    for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) spec[2 * (y * this.pw + x)] = data[y * w + x] - mean;
    fft2d(spec, this.pw, this.ph, false);
    this.spectrum = spec;
    this.sums = sumTables(image, mean);
  }

  /** Score maps of one or two templates, each (W − w + 1) × (H − h + 1). */
  scores(a: Gray, b?: Gray): Gray[] {
    const templates = b ? [a, b] : [a];
    for (const t of templates) {
      if (t.width < 1 || t.height < 1 || t.width > this.width || t.height > this.height) throw new RangeError("template must fit inside the image");
      if (t.data.length !== t.width * t.height) throw new RangeError("template size does not match its data");
    }
    const { pw, ph } = this;
    const g = new Float64Array(2 * pw * ph);
    const zm = templates.map(zeroMean);
    templates.forEach((t, k) => {
      const z = zm[k].data;
      for (let y = 0; y < t.height; y++) for (let x = 0; x < t.width; x++) g[2 * (y * pw + x) + k] = z[y * t.width + x];
    });
    fft2d(g, pw, ph, false);
    // Product F(k)·G(−k), written over a copy of the image spectrum.
    const prod = new Float64Array(2 * pw * ph);
    const f = this.spectrum;
    for (let ky = 0; ky < ph; ky++) {
      const my = (ph - ky) & (ph - 1);
      for (let kx = 0; kx < pw; kx++) {
        const mx = (pw - kx) & (pw - 1);
        const i = 2 * (ky * pw + kx);
        const j = 2 * (my * pw + mx);
        const fr = f[i];
        const fi = f[i + 1];
        const gr = g[j];
        const gi = g[j + 1];
        prod[i] = fr * gr - fi * gi;
        prod[i + 1] = fr * gi + fi * gr;
      }
    }
    fft2d(prod, pw, ph, true);
    return templates.map((t, k) => this.normalise(prod, k, t.width, t.height, zm[k].norm));
  }

  private normalise(corr: Float64Array, part: number, tw: number, th: number, templNorm: number): Gray {
    const ow = this.width - tw + 1;
    const oh = this.height - th + 1;
    const out = new Float32Array(ow * oh);
    // OpenCV: a template without variance correlates perfectly with everything.
    if (templNorm < Number.EPSILON) return { width: ow, height: oh, data: out.fill(1) };
    const n = tw * th;
    const stride = this.width + 1;
    const { s1, s2 } = this.sums;
    for (let v = 0; v < oh; v++) {
      for (let u = 0; u < ow; u++) {
        const a = v * stride + u;
        const b = a + tw;
        const c = a + th * stride;
        const d = c + tw;
        const sum = s1[d] - s1[b] - s1[c] + s1[a];
        const sum2 = s2[d] - s2[b] - s2[c] + s2[a];
        const t = Math.sqrt(Math.max(sum2 - (sum * sum) / n, 0)) * templNorm;
        let num = corr[2 * (v * this.pw + u) + part];
        // The same three cases as OpenCV's normalisation of TM_CCOEFF_NORMED.
        if (Math.abs(num) < t) num /= t;
        else if (Math.abs(num) < t * 1.125) num = num > 0 ? 1 : -1;
        else num = 0;
        out[v * ow + u] = num;
      }
    }
    return { width: ow, height: oh, data: out };
  }
}

/**
 * The ZNCC score map of `template` over `image`: (W − w + 1) × (H − h + 1) values in −1…1, the
 * value at (u, v) for the template's top-left corner at image pixel (u, v).
 */
export function znccScoreMap(image: Gray, template: Gray): Gray {
  return new ZnccPlan(image).scores(template)[0];
}
