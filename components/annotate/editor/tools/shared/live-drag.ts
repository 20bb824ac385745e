import type { AnyShape } from "@/lib/markup/types";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";

/**
 * The state shell shared by drags that reshape existing markup live (move, corner resize):
 * every pointer move shows `shapesAt(e)`, release records them as one history entry, and
 * cancel puts everything back.
 */
export function liveDragState(ctx: EditorContext, name: string, shapesAt: (e: PointerInput) => readonly AnyShape[]): ToolState {
  const live = ctx.beginLiveEdit();
  const update = (e: PointerInput) => live.set(shapesAt(e));
  return {
    name,
    interacting: true,
    pointerMove: update,
    pointerUp(e) {
      update(e);
      live.commit();
      ctx.toIdle();
    },
    cancel() {
      live.cancel();
    },
  };
}
