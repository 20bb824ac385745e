/**
 * A grey rectangle cut from one frame, in that frame's pixel coordinates (origin top-left).
 * Registration keeps only such strips of the frames' edges, never whole frames.
 */
export type GreyPatch = { data: Float32Array; x0: number; y0: number; width: number; height: number };

/** The rectangle [x0, x0+width) × [y0, y0+height) of a patch, clipped to what it holds. */
export function cropPatch(p: GreyPatch, x0: number, y0: number, width: number, height: number): GreyPatch {
  const cx0 = Math.max(p.x0, x0);
  const cy0 = Math.max(p.y0, y0);
  const cx1 = Math.min(p.x0 + p.width, x0 + width);
  const cy1 = Math.min(p.y0 + p.height, y0 + height);
  const w = Math.max(0, cx1 - cx0);
  const h = Math.max(0, cy1 - cy0);
  const data = new Float32Array(w * h);
  for (let y = 0; y < h; y++) {
    const from = (cy0 - p.y0 + y) * p.width + (cx0 - p.x0);
    data.set(p.data.subarray(from, from + w), y * w);
  }
  return { data, x0: cx0, y0: cy0, width: w, height: h };
}

/**
 * The patch shrunk by `factor` with a box average: coarse pixel (i, j) covers frame pixels
 * [i·factor, (i+1)·factor) × [j·factor, (j+1)·factor), so coarse coordinates are frame
 * coordinates divided by the factor.
 */
export function shrinkPatch(p: GreyPatch, factor: number): GreyPatch {
  if (factor === 1) return p;
  const x0 = Math.ceil(p.x0 / factor);
  const y0 = Math.ceil(p.y0 / factor);
  const width = Math.max(0, Math.floor((p.x0 + p.width) / factor) - x0);
  const height = Math.max(0, Math.floor((p.y0 + p.height) / factor) - y0);
  const data = new Float32Array(width * height);
  const scale = 1 / (factor * factor);
  for (let j = 0; j < height; j++) {
    const fy = (y0 + j) * factor - p.y0;
    for (let dy = 0; dy < factor; dy++) {
      const row = (fy + dy) * p.width - p.x0;
      for (let i = 0; i < width; i++) {
        const start = row + (x0 + i) * factor;
        let s = 0;
        for (let dx = 0; dx < factor; dx++) s += p.data[start + dx];
        data[j * width + i] += s;
      }
    }
    for (let i = 0; i < width; i++) data[j * width + i] *= scale;
  }
  return { data, x0, y0, width, height };
}
