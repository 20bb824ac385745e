import type { MosaicFrame } from "./types";

/**
 * Per-frame blend weights, separable: weight(x, y) = wx[x] · wy[y] in frame px. The core
 * [coreX0, coreX1) × [coreY0, coreY1) is where the weight is 1: the part of the mosaic this
 * frame alone shows (its neighbours weigh at most the floor there).
 */
export type BlendWeights = { wx: Float32Array; wy: Float32Array; coreX0: number; coreX1: number; coreY0: number; coreY1: number };

/** Longest linear blend either side of a seam, in px. */
const MAX_BLEND_HALF_WIDTH = 16;
/** Weight left at a frame's far side, so a corner no seam owns still shows some frame. */
const FLOOR = 1e-3;

type Seam = { at: number; half: number };

/** The seam between two neighbours sits in the middle of their overlap on one axis. */
function seamBetween(first: number, second: number, size: number): Seam | null {
  const overlap = first + size - second;
  if (overlap <= 0) return null;
  return { at: (first + size + second) / 2, half: Math.max(0.5, Math.min(MAX_BLEND_HALF_WIDTH, overlap / 4)) };
}

function ramp(origin: number, size: number, before: Seam | null, after: Seam | null): Float32Array {
  const w = new Float32Array(size);
  for (let i = 0; i < size; i++) {
    const p = origin + i + 0.5;
    const up = before ? Math.min(1, Math.max(0, (p - (before.at - before.half)) / (2 * before.half))) : 1;
    const down = after ? Math.min(1, Math.max(0, (after.at + after.half - p) / (2 * after.half))) : 1;
    w[i] = Math.max(FLOOR, Math.min(up, down));
  }
  return w;
}

/** The run of full weight (contiguous: the weight rises, stays at 1, then falls). */
function core(w: Float32Array): [number, number] {
  const first = w.indexOf(1);
  if (first < 0) return [0, 0];
  const last = w.lastIndexOf(1);
  return [first, last + 1];
}

/**
 * Blend weights that hand each frame the part of the mosaic up to the middle of its overlaps
 * with its grid neighbours, with a short linear cross-fade across every seam (at most
 * 2 × 16 px, never more than half the overlap). Composition divides by the summed weight, so
 * weights need not add up to one where jittered rows meet.
 */
export function blendWeights(frames: MosaicFrame[], frameWidth: number, frameHeight: number): BlendWeights[] {
  const byCell = new Map(frames.map((f) => [`${f.row},${f.col}`, f]));
  const cell = (row: number, col: number) => byCell.get(`${row},${col}`);
  const weights: BlendWeights[] = [];
  for (const f of frames) {
    const left = cell(f.row, f.col - 1);
    const right = cell(f.row, f.col + 1);
    const up = cell(f.row - 1, f.col);
    const down = cell(f.row + 1, f.col);
    const wx = ramp(f.x, frameWidth, left ? seamBetween(left.x, f.x, frameWidth) : null, right ? seamBetween(f.x, right.x, frameWidth) : null);
    const wy = ramp(f.y, frameHeight, up ? seamBetween(up.y, f.y, frameHeight) : null, down ? seamBetween(f.y, down.y, frameHeight) : null);
    const [coreX0, coreX1] = core(wx);
    const [coreY0, coreY1] = core(wy);
    weights[f.index] = { wx, wy, coreX0, coreX1, coreY0, coreY1 };
  }
  return weights;
}
