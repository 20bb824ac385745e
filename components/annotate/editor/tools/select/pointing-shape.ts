import type { AnyShape } from "@/lib/markup/types";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";
import { draggingSelection } from "./dragging";

/**
 * The shape a plain click selects from the stack under the pointer (best first). A second click
 * at the same spot, or an Alt-click, takes the next shape after the one selected, so every
 * shape of a stack (a pad, its bond's foot, the block around them) can be reached.
 */
export function clickedShape(ctx: EditorContext, stack: readonly AnyShape[], down: PointerInput): AnyShape {
  const last = ctx.clicks.last;
  const again = last !== null && Math.hypot(last[0] - down.x, last[1] - down.y) <= down.toleranceUm;
  ctx.clicks.last = [down.x, down.y];
  const selection = ctx.selection();
  const current = selection.size === 1 ? stack.findIndex((s) => selection.has(s.id)) : -1;
  if ((again || down.alt) && current >= 0 && stack.length > 1) return stack[(current + 1) % stack.length];
  return stack[0];
}

/**
 * Pressed on a shape (`stack`: every shape under the pointer, best first). Released in place:
 * the best shape alone is selected (or the next one of the stack on a repeated click), or it is
 * toggled with Shift. Moved beyond the tolerance (and allowed to edit): the selection is
 * dragged, first taking in the pressed shape unless the press was on the selection already.
 */
export function pointingShape(ctx: EditorContext, stack: readonly AnyShape[], onSelection: boolean, down: PointerInput): ToolState {
  const hit = stack[0];
  return {
    name: "select.pointing_shape",
    interacting: true,
    pointerMove(e) {
      if (!ctx.canEdit || Math.hypot(e.x - down.x, e.y - down.y) <= e.toleranceUm) return;
      ctx.clicks.last = null;
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
      if (!down.shift) ctx.setSelection([clickedShape(ctx, stack, down).id]);
      else {
        ctx.clicks.last = null;
        if (selection.has(hit.id)) ctx.setSelection([...selection].filter((id) => id !== hit.id));
        else ctx.setSelection([...selection, hit.id]);
      }
      ctx.toIdle();
    },
  };
}
