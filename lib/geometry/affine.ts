import type { Affine2x3, DiePoint, ImagePoint } from "./types";

/** Applies a 2x3 affine matrix to a plain (x, y) pair. */
export function applyAffine(m: Affine2x3, x: number, y: number): [number, number] {
  return [m[0][0] * x + m[0][1] * y + m[0][2], m[1][0] * x + m[1][1] * y + m[1][2]];
}

/** Determinant of the linear part; image→die transforms are negative (y flips). */
export function determinant(m: Affine2x3): number {
  return m[0][0] * m[1][1] - m[0][1] * m[1][0];
}

/** Inverse of an affine matrix; throws when it is singular. */
export function invertAffine(m: Affine2x3): Affine2x3 {
  const [[a, b, tx], [c, d, ty]] = m;
  const det = a * d - b * c;
  if (!Number.isFinite(det) || Math.abs(det) < 1e-300) throw new Error("transform is singular");
  const ia = d / det;
  const ib = -b / det;
  const ic = -c / det;
  const id = a / det;
  return [
    [ia, ib, -(ia * tx + ib * ty)],
    [ic, id, -(ic * tx + id * ty)],
  ];
}

/** Composes two transforms: (outer ∘ inner)(p) = outer(inner(p)). */
export function composeAffine(outer: Affine2x3, inner: Affine2x3): Affine2x3 {
  const [[a1, b1, t1], [c1, d1, u1]] = outer;
  const [[a2, b2, t2], [c2, d2, u2]] = inner;
  return [
    [a1 * a2 + b1 * c2, a1 * b2 + b1 * d2, a1 * t2 + b1 * u2 + t1],
    [c1 * a2 + d1 * c2, c1 * b2 + d1 * d2, c1 * t2 + d1 * u2 + u1],
  ];
}

/** Image pixels → die µm through a micrograph's transform. */
export function imageToDie(m: Affine2x3, p: ImagePoint): DiePoint {
  const [x, y] = applyAffine(m, p.x, p.y);
  return { x, y } as DiePoint;
}

/** Die µm → image pixels through the inverse of a micrograph's transform. */
export function dieToImage(m: Affine2x3, p: DiePoint): ImagePoint {
  const [x, y] = applyAffine(invertAffine(m), p.x, p.y);
  return { x, y } as ImagePoint;
}

/**
 * The transform the first micrograph of a die defines: uniform scale (µm/px), y flipped so
 * that the die frame is y-up, and the image's bottom-left pixel corner at the origin
 * unless an offset (die µm of image pixel (0, 0)) is given.
 */
export function frameFromScale(umPerPx: number, imageHeightPx: number, originUm: [number, number] = [0, 0]): Affine2x3 {
  return [
    [umPerPx, 0, originUm[0]],
    [0, -umPerPx, originUm[1] + imageHeightPx * umPerPx],
  ];
}

/** Mean scale (µm per px) of a transform: √|det|. */
export function meanScale(m: Affine2x3): number {
  return Math.sqrt(Math.abs(determinant(m)));
}
