import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";
import { boxSelecting } from "./box-selecting";

/** Pressed on empty space: a drag becomes a box selection, a click clears the selection (not with Shift). */
export function pointingCanvas(ctx: EditorContext, down: PointerInput): ToolState {
  return {
    name: "select.pointing_canvas",
    interacting: true,
    pointerMove(e) {
      if (Math.hypot(e.x - down.x, e.y - down.y) <= e.toleranceUm) return;
      const next = boxSelecting(ctx, down);
      ctx.transition(next);
      next.pointerMove?.(e);
    },
    pointerUp() {
      ctx.clicks.last = null;
      if (!down.shift) ctx.setSelection([]);
      ctx.toIdle();
    },
  };
}
