import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { axisAlignedBox } from "./rectangle";
import { editableVertices } from "./vertices";

/**
 * A grip the overlay draws on the selected shape: `corner` resizes an axis-aligned rectangle
 * (pad, die outline), `vertex` moves one vertex of a line or polygon. `index` is the vertex's
 * position in the line, or in the outer ring without its closing repeat.
 */
export type Handle = {
  readonly id: string;
  readonly shapeId: string;
  readonly type: "corner" | "vertex";
  readonly index: number;
  readonly position: Position;
};

/** Kinds that are rectangles in the die frame and resize by their corners. */
function isRectangleKind(kind: AnyShape["kind"]): boolean {
  return kind === "pad" || kind === "die_outline";
}

/**
 * The handles of a shape, the same ones the editor hit-tests. A pad or die outline that is not
 * an axis-aligned rectangle (an imported polygon) gets vertex handles instead of corners; a note
 * has none (it is moved by dragging).
 */
export function handlesFor(shape: AnyShape): Handle[] {
  const g = shape.geometry;
  if (g.type === "Point") return [];
  const corners = g.type === "Polygon" && isRectangleKind(shape.kind) && axisAlignedBox(g) !== null;
  const type = corners ? "corner" : "vertex";
  return editableVertices(g).map((position, index) => ({ id: `${shape.id}:${type}:${index}`, shapeId: shape.id, type, index, position }));
}

/** The handle nearest the point within the tolerance, or null. */
export function handleAt(shape: AnyShape, p: Position, toleranceUm: number): Handle | null {
  let best: Handle | null = null;
  let bestDistance = Infinity;
  for (const handle of handlesFor(shape)) {
    const d = Math.hypot(p[0] - handle.position[0], p[1] - handle.position[1]);
    if (d <= toleranceUm && d < bestDistance) [best, bestDistance] = [handle, d];
  }
  return best;
}
