import { shapesInBox } from "../../hit-test";
import { boxFromCorners } from "../../rectangle";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";

/**
 * Dragging a selection box from empty space: the shapes whose bounding box lies wholly inside
 * are selected as the box grows, added to the selection before when Shift was held. Escape
 * puts back the selection from before the press.
 */
export function boxSelecting(ctx: EditorContext, down: PointerInput): ToolState {
  const previous = ctx.selection();
  const initial = down.shift ? previous : new Set<string>();
  const update = (e: PointerInput) => {
    const box = boxFromCorners([down.x, down.y], [e.x, e.y]);
    ctx.setPreview({ type: "box", box });
    ctx.setSelection([...initial, ...shapesInBox(ctx.shapes().values(), box)]);
  };
  return {
    name: "select.box_selecting",
    interacting: true,
    pointerMove: update,
    pointerUp(e) {
      update(e);
      ctx.setPreview(null);
      ctx.toIdle();
    },
    cancel() {
      ctx.setSelection(previous);
    },
  };
}
