import type { AnyShape } from "@/lib/markup/types";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";
import { draggingSelection } from "./dragging";

/**
 * Pressed on a shape. Released in place: the shape alone is selected, or toggled with Shift.
 * Moved beyond the tolerance (and allowed to edit): the selection is dragged, first taking in
 * the pressed shape unless the press was on the selection already.
 */
export function pointingShape(ctx: EditorContext, hit: AnyShape, onSelection: boolean, down: PointerInput): ToolState {
  return {
    name: "select.pointing_shape",
    interacting: true,
    pointerMove(e) {
      if (!ctx.canEdit || Math.hypot(e.x - down.x, e.y - down.y) <= e.toleranceUm) return;
      const selection = ctx.selection();
      if (!selection.has(hit.id)) {
        if (down.shift) ctx.setSelection([...selection, hit.id]);
        else if (!onSelection) ctx.setSelection([hit.id]);
      }
      const next = draggingSelection(ctx, down);
      ctx.transition(next);
      next.pointerMove?.(e);
    },
    pointerUp() {
      const selection = ctx.selection();
      if (!down.shift) ctx.setSelection([hit.id]);
      else if (selection.has(hit.id)) ctx.setSelection([...selection].filter((id) => id !== hit.id));
      else ctx.setSelection([...selection, hit.id]);
      ctx.toIdle();
    },
  };
}
