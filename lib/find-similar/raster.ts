import type { Gray, PixelSource, PxBox, Rotation } from "./types";

/** Small raster operations of the template search (pure). */

/** Output size of a box read at `scale` (see PixelSource). */
export function scaledSize(box: PxBox, scale: number): [number, number] {
  return [Math.max(1, Math.round(box.w * scale)), Math.max(1, Math.round(box.h * scale))];
}

/** Per output index, the source indices and weights of an area average over [x0, x0 + span). */
function areaWeights(x0: number, span: number, out: number, limit: number): { first: Int32Array; count: Int32Array; w: Float32Array; stride: number } {
  const step = span / out;
  const stride = Math.ceil(step) + 2;
  const first = new Int32Array(out);
  const count = new Int32Array(out);
  const w = new Float32Array(out * stride);
  for (let i = 0; i < out; i++) {
    const a = x0 + i * step;
    const b = a + step;
    const lo = Math.max(0, Math.floor(a));
    const hi = Math.min(limit, Math.ceil(b));
    first[i] = lo;
    count[i] = Math.max(0, hi - lo);
    let total = 0;
    for (let k = lo; k < hi; k++) {
      const wt = Math.max(0, Math.min(b, k + 1) - Math.max(a, k));
      w[i * stride + (k - lo)] = wt;
      total += wt;
    }
    for (let k = 0; k < hi - lo; k++) w[i * stride + k] /= total || 1;
  }
  return { first, count, w, stride };
}

/**
 * The area-average resampling of the continuous box (x0, y0, w, h) of `src` (in src px) to
 * outW × outH px: each output pixel is the mean of the source area it covers (exact for
 * integer factors, what a pyramid level holds).
 */
export function resampleArea(src: Gray, x0: number, y0: number, w: number, h: number, outW: number, outH: number): Gray {
  const xs = areaWeights(x0, w, outW, src.width);
  const ys = areaWeights(y0, h, outH, src.height);
  // Rows first (outW × source rows of the box), then columns.
  const rowLo = ys.first[0];
  const rowHi = ys.first[outH - 1] + ys.count[outH - 1];
  const tmp = new Float32Array(outW * (rowHi - rowLo));
  for (let r = rowLo; r < rowHi; r++) {
    const base = r * src.width;
    for (let i = 0; i < outW; i++) {
      let v = 0;
      for (let k = 0; k < xs.count[i]; k++) v += src.data[base + xs.first[i] + k] * xs.w[i * xs.stride + k];
      tmp[(r - rowLo) * outW + i] = v;
    }
  }
  const out = new Float32Array(outW * outH);
  for (let j = 0; j < outH; j++) {
    for (let k = 0; k < ys.count[j]; k++) {
      const wt = ys.w[j * ys.stride + k];
      const row = (ys.first[j] + k - rowLo) * outW;
      for (let i = 0; i < outW; i++) out[j * outW + i] += tmp[row + i] * wt;
    }
  }
  return { width: outW, height: outH, data: out };
}

/** A PixelSource over a raster held in memory (tests, and images small enough to decode whole). */
export function graySource(img: Gray): PixelSource {
  return {
    width: img.width,
    height: img.height,
    async read(box, scale) {
      const [w, h] = scaledSize(box, scale);
      return resampleArea(img, box.x, box.y, box.w, box.h, w, h);
    },
  };
}

/** The template seen mirrored (left–right) first, then turned clockwise on screen by `rotation`. */
export function orient(t: Gray, rotation: Rotation, mirrored: boolean): Gray {
  const { width: w, height: h, data } = t;
  const turned = rotation === 90 || rotation === 270;
  const ow = turned ? h : w;
  const oh = turned ? w : h;
  const out = new Float32Array(w * h);
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const mx = mirrored ? w - 1 - x : x;
      // Clockwise quarter turns in image axes (y down): (x, y) → (h − 1 − y, x) per turn.
      let nx = mx;
      let ny = y;
      if (rotation === 90) [nx, ny] = [h - 1 - y, mx];
      else if (rotation === 180) [nx, ny] = [w - 1 - mx, h - 1 - y];
      else if (rotation === 270) [nx, ny] = [y, w - 1 - mx];
      out[ny * ow + nx] = data[y * w + x];
    }
  }
  return { width: ow, height: oh, data: out };
}
