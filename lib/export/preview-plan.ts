import type { Affine2x3 } from "@/lib/geometry/types";
import { planRender, type PlanRequest, type RenderPlan, type SourceImage } from "./render-plan";

/** Widest preview the export form shows. */
export const PREVIEW_WIDTH_PX = 640;

/**
 * The same micrograph seen through a downscaled copy of it (the tiler's preview JPEG): its
 * pixel (u, v) is original pixel (u · W / w, v · H / h), so the transform gains that scale.
 */
export function downscaledSource(original: SourceImage, width: number, height: number): SourceImage {
  const kx = original.width / width;
  const ky = original.height / height;
  const [[a, b, tx], [c, d, ty]] = original.transform;
  const transform: Affine2x3 = [
    [a * kx, b * ky, tx],
    [c * kx, d * ky, ty],
  ];
  return { width, height, transform };
}

/**
 * A plan of the same region as `full`, at most `maxWidth` px wide, read from the downscaled
 * copy when that copy still has at least one pixel per output pixel there, else from the
 * original. Says which it chose.
 */
export function previewPlan(
  original: SourceImage,
  copy: { width: number; height: number } | null,
  full: RenderPlan,
  maxWidth = PREVIEW_WIDTH_PX,
): { plan: RenderPlan; fromCopy: boolean } {
  const req: PlanRequest = { region: full.region, widthPx: Math.min(maxWidth, full.width) };
  const die = { widthUm: null, heightUm: null };
  if (copy) {
    const planned = planRender(downscaledSource(original, copy.width, copy.height), die, req);
    if (planned.ok && planned.plan.sourcePxPerOutputPx >= 1 - 1e-9) return { plan: planned.plan, fromCopy: true };
  }
  const planned = planRender(original, die, req);
  if (!planned.ok) throw new Error(planned.message);
  return { plan: planned.plan, fromCopy: false };
}
