import { applyAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import type { ControlPointPair } from "./types";

/** Seeded uniform generator (mulberry32) so noisy tests repeat exactly. Test use only. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Normal deviates by the Box–Muller transform. Test use only. */
export function seededGaussian(seed: number): () => number {
  const uniform = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/**
 * Image px → die µm similarity: scale s (µm/px), rotation by deg counter-clockwise in the die
 * frame, y flipped unless mirrored, then the shift (tx, ty). Test use only.
 */
export function similarityTransform(s: number, deg: number, tx: number, ty: number, mirrored = false): Affine2x3 {
  const c = s * Math.cos((deg * Math.PI) / 180);
  const n = s * Math.sin((deg * Math.PI) / 180);
  const f = mirrored ? 1 : -1;
  // [c −n; n c]·diag(1, f)
  return [
    [c, -n * f, tx],
    [n, c * f, ty],
  ];
}

/** Pairs made by mapping image points through a transform, optional die-side noise (µm). */
export function pairsThrough(m: Affine2x3, imagePoints: readonly [number, number][], noise?: () => number): ControlPointPair[] {
  return imagePoints.map(([x, y]) => {
    const [u, v] = applyAffine(m, x, y);
    return { imagePx: [x, y], dieUm: noise ? [u + noise(), v + noise()] : [u, v] };
  });
}
