import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { DieRegion } from "./render-plan";

/**
 * The die rectangle (lower-left corner, width, height) that covers the given image-pixel
 * corners once mapped through the micrograph's image → die transform.
 */
export function dieRegionOfImageCorners(transform: Affine2x3, corners: readonly { x: number; y: number }[]): DieRegion {
  const pts = corners.map((c) => applyAffine(transform, c.x, c.y));
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  return { x, y, width: Math.max(...xs) - x, height: Math.max(...ys) - y };
}

/** What the die's markup covers in die µm (wire bonds run past the die edge to the package). */
export type ExtentUm = { readonly minX: number; readonly minY: number; readonly maxX: number; readonly maxY: number };

/** Margin around a whole-die export, as a fraction of its larger side. */
export const WHOLE_DIE_MARGIN = 0.03;

/**
 * The region of a "whole die" export: the die rectangle grown to take in every shape drawn
 * around it (bond wires out to the package), plus a margin of 3 % of the larger side on every
 * edge so nothing touches the border. Null when the die has no size.
 */
export function wholeDieRegion(die: { readonly widthUm: number | null; readonly heightUm: number | null; readonly extentUm?: ExtentUm | null }): DieRegion | null {
  if (!die.widthUm || !die.heightUm) return null;
  const e = die.extentUm;
  const x0 = Math.min(0, e?.minX ?? 0);
  const y0 = Math.min(0, e?.minY ?? 0);
  const x1 = Math.max(die.widthUm, e?.maxX ?? 0);
  const y1 = Math.max(die.heightUm, e?.maxY ?? 0);
  const margin = WHOLE_DIE_MARGIN * Math.max(x1 - x0, y1 - y0);
  return { x: x0 - margin, y: y0 - margin, width: x1 - x0 + 2 * margin, height: y1 - y0 + 2 * margin };
}
