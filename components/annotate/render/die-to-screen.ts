import { composeAffine, invertAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";

/** The viewer's image px → screen px map, sampled at the current (animating) view. */
export type ImageToScreen = (x: number, y: number) => { x: number; y: number };

/**
 * The one transform from the die frame to the screen: die µm → image px (inverse of the
 * micrograph's transform) → screen px (the viewer's affine view, sampled at three points so
 * rotation and flip are included). Shapes are never rewritten on pan or zoom; only this changes.
 */
export function dieToScreenMatrix(imageToDie: Affine2x3, imageToScreen: ImageToScreen): Affine2x3 {
  const o = imageToScreen(0, 0);
  const ex = imageToScreen(1, 0);
  const ey = imageToScreen(0, 1);
  const view: Affine2x3 = [
    [ex.x - o.x, ey.x - o.x, o.x],
    [ex.y - o.y, ey.y - o.y, o.y],
  ];
  return composeAffine(view, invertAffine(imageToDie));
}

/** Screen px per die µm (mean, for constant-width strokes and level of detail). */
export function screenPxPerUm(m: Affine2x3): number {
  return Math.sqrt(Math.abs(m[0][0] * m[1][1] - m[0][1] * m[1][0]));
}
