import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";

/** The cursor's position as shown: die µm when the micrograph has a transform, else image px. */
export type CursorReading = { unit: "µm" | "px"; x: number; y: number; text: string };

/**
 * Reads an image position (full-resolution px) in the die frame through the micrograph's
 * transform, or in image px when there is none; null when there is no position.
 */
export function cursorReading(image: { x: number; y: number } | null, transform: Affine2x3 | null): CursorReading | null {
  if (!image || !Number.isFinite(image.x) || !Number.isFinite(image.y)) return null;
  const unit = transform ? "µm" : "px";
  const [x, y] = transform ? applyAffine(transform, image.x, image.y) : [image.x, image.y];
  return { unit, x, y, text: `x ${x.toFixed(1)} ${unit} · y ${y.toFixed(1)} ${unit}` };
}
