import { overlapEdgeNcc, overlapNcc, parabolicOffset, phaseCorrelationPeaks } from "./correlation";
import { cropPatch, shrinkPatch, type GreyPatch } from "./patch";

/** Where the grid and the nominal overlap put frame b against frame a, and how far to look. */
export type PairGeometry = {
  /** Expected translation b − a in px. */
  nominal: { dx: number; dy: number };
  /** Half-width of the searched window around the nominal translation, in px. */
  search: { x: number; y: number };
};

/**
 * A measured translation b − a (sub-pixel) and how well the overlaps match there: the NCC of
 * their high-passed pixels (see overlapEdgeNcc), about 0 for a blank overlap.
 */
export type PairMeasurement = { dx: number; dy: number; peak: number };

/** Fewest overlap pixels, as a share of the nominal overlap, that a candidate may rest on. */
const MIN_OVERLAP_SHARE = 0.15;

function coarseTranslation(a: GreyPatch, b: GreyPatch, g: PairGeometry, factor: number): { tx: number; ty: number } | null {
  const ac = shrinkPatch(a, factor);
  const bc = shrinkPatch(b, factor);
  const nx = Math.round(g.nominal.dx / factor);
  const ny = Math.round(g.nominal.dy / factor);
  // The part of b that the nominal translation lays over a, and the same part of a.
  const vx0 = Math.max(bc.x0, ac.x0 - nx);
  const vy0 = Math.max(bc.y0, ac.y0 - ny);
  const w = Math.min(bc.x0 + bc.width, ac.x0 + ac.width - nx) - vx0;
  const h = Math.min(bc.y0 + bc.height, ac.y0 + ac.height - ny) - vy0;
  if (w < 4 || h < 4) return null;
  const reference = cropPatch(ac, vx0 + nx, vy0 + ny, w, h).data;
  const moving = cropPatch(bc, vx0, vy0, w, h).data;
  const limitX = g.search.x / factor + 1;
  const limitY = g.search.y / factor + 1;
  // tx, ty keep the sub-pixel peak, which starts the full-resolution search closer.
  let best: { tx: number; ty: number; ncc: number } | null = null;
  for (const peak of phaseCorrelationPeaks(reference, moving, w, h, 3)) {
    // moving(u) = reference(u − d) means t = nominal − d; d is known modulo the padded size.
    for (const kx of [-1, 0, 1]) {
      for (const ky of [-1, 0, 1]) {
        const fx = nx - (peak.dx + kx * peak.periodX);
        const fy = ny - (peak.dy + ky * peak.periodY);
        const tx = Math.round(fx);
        const ty = Math.round(fy);
        if (Math.abs(tx - nx) > limitX || Math.abs(ty - ny) > limitY) continue;
        const o = overlapNcc(ac, bc, tx, ty);
        if (o.pixels < MIN_OVERLAP_SHARE * w * h) continue;
        if (!best || o.ncc > best.ncc) best = { tx: fx, ty: fy, ncc: o.ncc };
      }
    }
  }
  return best ? { tx: Math.round(best.tx * factor), ty: Math.round(best.ty * factor) } : null;
}

/**
 * Measures the translation of frame b against frame a from strips of their shared edge:
 * phase correlation of the nominal overlap on strips shrunk by `factor`, the circular-shift
 * aliases of its highest peaks ranked by normalised cross-correlation (NCC) of the overlaps
 * they imply, then at full resolution a hill climb on the NCC of the overlap (as in MIST,
 * Chalfoun et al., Sci. Rep. 7:4988, 2017) and a parabola through the NCC around its maximum
 * for the sub-pixel part. `peak` is the high-pass NCC at the result; the caller decides
 * whether it is trustworthy.
 */
export function registerPair(a: GreyPatch, b: GreyPatch, g: PairGeometry, factor: number): PairMeasurement {
  const start = coarseTranslation(a, b, g, factor);
  if (!start) return { dx: g.nominal.dx, dy: g.nominal.dy, peak: 0 };
  const minPixels = MIN_OVERLAP_SHARE * Math.max(1, nominalOverlapPixels(a, b, g));
  // Large frames: every other row is plenty for the NCC and halves the work.
  const rowStep = factor > 1 ? 2 : 1;
  const cache = new Map<string, number>();
  const score = (tx: number, ty: number) => {
    const key = `${tx},${ty}`;
    let v = cache.get(key);
    if (v === undefined) {
      const o = overlapNcc(a, b, tx, ty, rowStep);
      const inside = Math.abs(tx - g.nominal.dx) <= g.search.x + factor && Math.abs(ty - g.nominal.dy) <= g.search.y + factor;
      v = inside && o.pixels >= minPixels ? o.ncc : -2;
      cache.set(key, v);
    }
    return v;
  };
  let { tx, ty } = start;
  for (let step = 0; step < 64; step++) {
    let next = { tx, ty, v: score(tx, ty) };
    for (let dy = -1; dy <= 1; dy++) {
      for (let dx = -1; dx <= 1; dx++) {
        const v = score(tx + dx, ty + dy);
        if (v > next.v) next = { tx: tx + dx, ty: ty + dy, v };
      }
    }
    if (next.tx === tx && next.ty === ty) break;
    tx = next.tx;
    ty = next.ty;
  }
  const peak = score(tx, ty);
  if (peak <= -2) return { dx: g.nominal.dx, dy: g.nominal.dy, peak: 0 };
  const fx = parabolicOffset(score(tx - 1, ty), peak, score(tx + 1, ty));
  const fy = parabolicOffset(score(tx, ty - 1), peak, score(tx, ty + 1));
  return { dx: tx + fx, dy: ty + fy, peak: overlapEdgeNcc(a, b, tx, ty).ncc };
}

function nominalOverlapPixels(a: GreyPatch, b: GreyPatch, g: PairGeometry): number {
  const nx = Math.round(g.nominal.dx);
  const ny = Math.round(g.nominal.dy);
  const w = Math.min(b.x0 + b.width, a.x0 + a.width - nx) - Math.max(b.x0, a.x0 - nx);
  const h = Math.min(b.y0 + b.height, a.y0 + a.height - ny) - Math.max(b.y0, a.y0 - ny);
  return Math.max(0, w) * Math.max(0, h);
}
