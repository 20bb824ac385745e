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
