import { composeAffine, invertAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import type { DieLayout } from "./layout-types";

/**
 * Where a rendering puts the die: the exact die µm → image px transform of one demo
 * micrograph. Image coordinates are continuous: (0, 0) is the top-left corner of the
 * top-left pixel, so pixel (i, j) covers [i, i + 1) × [j, j + 1) and its centre is
 * (i + 0.5, j + 0.5).
 */

export type PlacementOptions = {
  /** Pixels per µm before the extra scale is applied. */
  pxPerUm: number;
  /** Package/background shown around the die on every side, in µm. */
  marginUm: number;
  /** Extra rotation about the image centre, degrees; positive turns clockwise on screen. */
  rotateDeg?: number;
  /** Extra uniform scale about the image centre (1.02 = 2 % larger). */
  scale?: number;
  /** Extra shift in image px, applied last. */
  shiftPx?: readonly [number, number];
};

export type Placement = {
  readonly widthPx: number;
  readonly heightPx: number;
  /** Die µm → image px. */
  readonly dieToImage: Affine2x3;
  /** Image px → die µm: the ground-truth transform of the rendering. */
  readonly imageToDie: Affine2x3;
};

/**
 * The canvas size and transforms of a rendering: the die with `marginUm` around it at
 * `pxPerUm` (y flipped: die y up, image y down), then turned, scaled and shifted as asked.
 */
export function placeDie(layout: DieLayout, options: PlacementOptions): Placement {
  const { pxPerUm: p, marginUm: m, rotateDeg = 0, scale = 1, shiftPx = [0, 0] } = options;
  if (!(p > 0) || !(m >= 0) || !(scale > 0)) throw new RangeError("pxPerUm and scale must be positive, marginUm not negative");
  const [dieW, dieH] = layout.dieSizeUm;
  const widthPx = Math.round((dieW + 2 * m) * p);
  const heightPx = Math.round((dieH + 2 * m) * p);
  const base: Affine2x3 = [
    [p, 0, m * p],
    [0, -p, (dieH + m) * p],
  ];
  const t = (rotateDeg * Math.PI) / 180;
  const cos = scale * Math.cos(t);
  const sin = scale * Math.sin(t);
  const [cx, cy] = [widthPx / 2, heightPx / 2];
  // q = s·R·(u − c) + c + shift, with R = [[cos, −sin], [sin, cos]] in y-down image axes.
  const extra: Affine2x3 = [
    [cos, -sin, cx - cos * cx + sin * cy + shiftPx[0]],
    [sin, cos, cy - sin * cx - cos * cy + shiftPx[1]],
  ];
  const dieToImage = composeAffine(extra, base);
  return { widthPx, heightPx, dieToImage, imageToDie: invertAffine(dieToImage) };
}

/** Pixels per µm that make the rendering `widthPx` wide with `marginUm` on each side. */
export function pxPerUmForWidth(layout: DieLayout, widthPx: number, marginUm: number): number {
  return widthPx / (layout.dieSizeUm[0] + 2 * marginUm);
}
