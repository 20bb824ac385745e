import { detectDieEdge } from "@/lib/die-edge/detect";
import type { PixelSource } from "@/lib/find-similar/types";

/** The long side, in px, of the reduced copy the die edge is looked for in. */
const MAX_SIDE = 2048;

/**
 * The die outline of a micrograph (lib/die-edge/detect.ts: gradient projections, then a robust
 * least-squares line per side) found in a reduced copy of the whole image, so memory stays
 * bounded; corners in full-resolution px, counter-clockwise from the lower-left.
 */
export async function detectDieEdgeOf(src: PixelSource): Promise<{ cornersPx: [number, number][]; confidence: number }> {
  let f = 1;
  while (Math.max(src.width, src.height) / f > MAX_SIDE) f *= 2;
  const img = await src.read({ x: 0, y: 0, w: src.width, h: src.height }, 1 / f);
  // A reduced pixel i covers full-resolution px [i·f, (i + 1)·f), so coordinates scale by f.
  const sx = src.width / img.width;
  const sy = src.height / img.height;
  const { corners, confidence } = detectDieEdge(img);
  return { cornersPx: corners.map(([x, y]) => [x * sx, y * sy]), confidence };
}
