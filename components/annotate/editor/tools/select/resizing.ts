import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import type { Handle } from "../../handles";
import { withGeometry } from "../../model";
import { boxFromCorners, rectangleGeometry } from "../../rectangle";
import type { EditorContext, ToolState } from "../../tool-state";
import { liveDragState } from "../shared/live-drag";
import type { PointerInput } from "../../types";
import { editableVertices } from "../../vertices";

/** Keeps `d` at least `min` away from zero, on its own side (zero counts as positive). */
function atLeast(d: number, min: number): number {
  return Math.abs(d) >= min ? d : d < 0 ? -min : min;
}

/**
 * Dragging a corner of an axis-aligned rectangle (pad, die outline): the opposite corner stays
 * put, the rectangle may flip through it, and it never becomes thinner than the tolerance.
 */
export function resizing(ctx: EditorContext, shape: AnyShape, handle: Handle, down: PointerInput): ToolState {
  if (shape.geometry.type !== "Polygon") throw new TypeError("only polygons have corner handles");
  const corners = editableVertices(shape.geometry);
  const fixed = corners[(handle.index + 2) % 4];
  // Where the press was relative to the corner, so the corner does not jump to the pointer.
  const offset: Position = [handle.position[0] - down.x, handle.position[1] - down.y];
  return liveDragState(ctx, "select.resizing", (e: PointerInput) => {
    const dx = atLeast(e.x + offset[0] - fixed[0], e.toleranceUm);
    const dy = atLeast(e.y + offset[1] - fixed[1], e.toleranceUm);
    const box = boxFromCorners(fixed, [fixed[0] + dx, fixed[1] + dy]);
    return [withGeometry(shape, rectangleGeometry(box), ctx.stamp.now())];
  });
}
