import { translateGeometry } from "@/lib/geometry/transform-geometry";
import type { AnyShape } from "@/lib/markup/types";
import { withGeometry } from "../../model";
import type { EditorContext, ToolState } from "../../tool-state";
import { liveDragState } from "../shared/live-drag";
import type { PointerInput } from "../../types";

/**
 * Moving the selection with the pointer, live; one history entry on release. Shift keeps the
 * move horizontal or vertical, whichever is larger.
 */
export function draggingSelection(ctx: EditorContext, down: PointerInput): ToolState {
  const shapes = ctx.shapes();
  const originals = [...ctx.selection()].map((id) => shapes.get(id)).filter((s): s is AnyShape => s !== undefined);
  return liveDragState(ctx, "select.dragging", (e: PointerInput) => {
    let dx = e.x - down.x;
    let dy = e.y - down.y;
    if (e.shift) {
      if (Math.abs(dx) >= Math.abs(dy)) dy = 0;
      else dx = 0;
    }
    const now = ctx.stamp.now();
    return originals.map((s) => withGeometry(s, translateGeometry(s.geometry, dx, dy), now));
  });
}
