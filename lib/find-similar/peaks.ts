import type { Gray, PxBox } from "./types";

/** Peak finding in score maps (pure). */

export type Peak = { u: number; v: number; score: number };

/**
 * Local maxima of a score map (≥ each of the 8 neighbours, > on the ones before it so a flat top
 * gives one peak) at or above `threshold`, best first, at most `limit`.
 */
export function localMaxima(map: Gray, threshold: number, limit: number): Peak[] {
  const { width: w, height: h, data } = map;
  const peaks: Peak[] = [];
  for (let v = 0; v < h; v++) {
    for (let u = 0; u < w; u++) {
      const s = data[v * w + u];
      if (!(s >= threshold)) continue;
      let isMax = true;
      for (let dv = -1; dv <= 1 && isMax; dv++) {
        const y = v + dv;
        if (y < 0 || y >= h) continue;
        for (let du = -1; du <= 1; du++) {
          const x = u + du;
          if ((du === 0 && dv === 0) || x < 0 || x >= w) continue;
          const n = data[y * w + x];
          const before = dv < 0 || (dv === 0 && du < 0);
          if (n > s || (before && n === s)) {
            isMax = false;
            break;
          }
        }
      }
      if (isMax) peaks.push({ u, v, score: s });
    }
  }
  peaks.sort((a, b) => b.score - a.score);
  return peaks.length > limit ? peaks.slice(0, limit) : peaks;
}

/**
 * Sub-pixel offset of a peak from a parabola through it and its two neighbours, per axis
 * (the three-point quadratic fit); within ±0.5, 0 on a border or a flat top.
 */
export function subPixelOffset(map: Gray, u: number, v: number): [number, number] {
  const { width: w, height: h, data } = map;
  const c = data[v * w + u];
  const fit = (l: number, r: number) => {
    const d = l - 2 * c + r;
    return d < 0 ? Math.max(-0.5, Math.min(0.5, (l - r) / (2 * d))) : 0;
  };
  const dx = u > 0 && u < w - 1 ? fit(data[v * w + u - 1], data[v * w + u + 1]) : 0;
  const dy = v > 0 && v < h - 1 ? fit(data[(v - 1) * w + u], data[(v + 1) * w + u]) : 0;
  return [dx, dy];
}

/** Intersection over union of two boxes. */
export function iou(a: PxBox, b: PxBox): number {
  const ix = Math.max(0, Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x));
  const iy = Math.max(0, Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y));
  const inter = ix * iy;
  return inter / (a.w * a.h + b.w * b.h - inter);
}

/**
 * Greedy non-maximum suppression: best first, an item is dropped when its centre lies within
 * `radius` of an item already kept, so one feature gives one candidate whichever variant matched.
 */
export function suppressNonMaxima<T extends { centre: [number, number]; score: number }>(items: T[], radius: number): T[] {
  const sorted = [...items].sort((a, b) => b.score - a.score);
  const kept: T[] = [];
  // A grid of kept centres keeps this linear for thousands of peaks.
  const cell = Math.max(1, radius);
  const grid = new Map<string, T[]>();
  const key = (x: number, y: number) => `${x},${y}`;
  for (const it of sorted) {
    const gx = Math.floor(it.centre[0] / cell);
    const gy = Math.floor(it.centre[1] / cell);
    let clash = false;
    for (let dy = -1; dy <= 1 && !clash; dy++)
      for (let dx = -1; dx <= 1 && !clash; dx++)
        for (const k of grid.get(key(gx + dx, gy + dy)) ?? [])
          if (Math.hypot(k.centre[0] - it.centre[0], k.centre[1] - it.centre[1]) < radius) {
            clash = true;
            break;
          }
    if (clash) continue;
    kept.push(it);
    const list = grid.get(key(gx, gy));
    if (list) list.push(it);
    else grid.set(key(gx, gy), [it]);
  }
  return kept;
}
