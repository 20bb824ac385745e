import { CholeskyDecomposition, Matrix } from "ml-matrix";
import type { MosaicPair } from "./types";

/** A neighbour pair as registration measured it, before the stage model judged it. */
export type MeasuredPair = {
  a: number;
  b: number;
  /** Neighbours side by side (b right of a) or one above the other (b below a). */
  direction: "horizontal" | "vertical";
  nominal: { dx: number; dy: number };
  dx: number;
  dy: number;
  peak: number;
};

/** Below this overlap NCC a measured translation is not trusted. */
const MIN_TRUSTED_PEAK = 0.3;

/** Weight of a stage-model translation in the placement: a soft hint beside real measurements. */
const STAGE_MODEL_WEIGHT = 1e-3;

function median(values: number[]): number {
  const s = [...values].sort((p, q) => p - q);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Keeps trustworthy measurements and replaces weak ones (peak below MIN_TRUSTED_PEAK, e.g. a
 * blank overlap) by the stage model: the median translation of the trusted pairs in the same
 * direction (Chalfoun et al., Sci. Rep. 7:4988, 2017), or the nominal translation when no
 * pair in that direction could be trusted. Every replacement is named in a warning.
 */
export function applyStageModel(measured: MeasuredPair[]): { pairs: MosaicPair[]; warnings: string[] } {
  const warnings: string[] = [];
  const model = new Map<MeasuredPair["direction"], { dx: number; dy: number } | null>();
  for (const direction of ["horizontal", "vertical"] as const) {
    const good = measured.filter((p) => p.direction === direction && p.peak >= MIN_TRUSTED_PEAK);
    model.set(direction, good.length ? { dx: median(good.map((p) => p.dx)), dy: median(good.map((p) => p.dy)) } : null);
  }
  const round = (v: number) => Math.round(v * 100) / 100;
  const pairs = measured.map((p): MosaicPair => {
    const peak = round(Math.max(-1, Math.min(1, p.peak)));
    if (p.peak >= MIN_TRUSTED_PEAK) return { a: p.a, b: p.b, dx: round(p.dx), dy: round(p.dy), peak, used: "measured" };
    const m = model.get(p.direction);
    const source = m ? "the median of the trusted pairs in that direction" : "the nominal overlap (no trusted pair in that direction)";
    warnings.push(`Frames ${p.a + 1} and ${p.b + 1}: the overlap matched weakly (correlation ${peak.toFixed(2)}); placed by ${source}.`);
    const t = m ?? p.nominal;
    return { a: p.a, b: p.b, dx: round(t.dx), dy: round(t.dy), peak, used: "stage_model" };
  });
  return { pairs, warnings };
}

/**
 * Frame positions from all pair translations by weighted least squares (the global
 * optimisation of Preibisch, Saalfeld & Tomancak, Bioinformatics 25(11), 2009, here for
 * translations only): minimises Σ w·|(p_b − p_a) − t_ab|² with frame 0 held at the origin.
 * Measured pairs weigh their peak², stage-model pairs very little, so a frame with one blank
 * overlap is placed by its other neighbours. The residual is taken over measured pairs.
 */
export function placeFrames(frameCount: number, pairs: MosaicPair[]): { positions: { x: number; y: number }[]; residualPx: { rms: number; max: number } } {
  const n = frameCount - 1;
  const positions = Array.from({ length: frameCount }, () => ({ x: 0, y: 0 }));
  if (n > 0) {
    const normal = Matrix.zeros(n, n);
    const rhs = Matrix.zeros(n, 2);
    for (const p of pairs) {
      const w = p.used === "measured" ? Math.max(p.peak, MIN_TRUSTED_PEAK) ** 2 : STAGE_MODEL_WEIGHT;
      const ia = p.a - 1;
      const ib = p.b - 1;
      if (ia >= 0) normal.set(ia, ia, normal.get(ia, ia) + w);
      if (ib >= 0) normal.set(ib, ib, normal.get(ib, ib) + w);
      if (ia >= 0 && ib >= 0) {
        normal.set(ia, ib, normal.get(ia, ib) - w);
        normal.set(ib, ia, normal.get(ib, ia) - w);
      }
      if (ib >= 0) {
        rhs.set(ib, 0, rhs.get(ib, 0) + w * p.dx);
        rhs.set(ib, 1, rhs.get(ib, 1) + w * p.dy);
      }
      if (ia >= 0) {
        rhs.set(ia, 0, rhs.get(ia, 0) - w * p.dx);
        rhs.set(ia, 1, rhs.get(ia, 1) - w * p.dy);
      }
    }
    const chol = new CholeskyDecomposition(normal);
    if (!chol.isPositiveDefinite()) throw new RangeError("the pairs do not connect every frame to frame 0");
    const solved = chol.solve(rhs);
    for (let i = 0; i < n; i++) positions[i + 1] = { x: solved.get(i, 0), y: solved.get(i, 1) };
  }
  let sum = 0;
  let max = 0;
  let count = 0;
  for (const p of pairs) {
    if (p.used !== "measured") continue;
    const r = Math.hypot(positions[p.b].x - positions[p.a].x - p.dx, positions[p.b].y - positions[p.a].y - p.dy);
    sum += r * r;
    max = Math.max(max, r);
    count++;
  }
  return { positions, residualPx: { rms: count ? Math.sqrt(sum / count) : 0, max } };
}
