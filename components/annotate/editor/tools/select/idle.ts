import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { handleAt } from "../../handles";
import { hitsAt, shapeAt } from "../../hit-test";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";
import { hasFreeVertices } from "../../vertices";
import { pointingCanvas } from "./pointing-canvas";
import { pointingShape } from "./pointing-shape";
import { resizing } from "./resizing";
import { insertVertex, removeVertexAt } from "./vertex-edits";
import { vertexDragging } from "./vertex-dragging";

function singleSelected(ctx: EditorContext): AnyShape | null {
  const selection = ctx.selection();
  if (selection.size !== 1) return null;
  const [id] = selection;
  return ctx.shapes().get(id) ?? null;
}

/**
 * Handles are only offered on a single selected shape. A press on one resizes or drags a
 * vertex; with Alt it removes the vertex, and Alt on an edge adds one. True when the press was
 * used here.
 */
function pressOnSelectedShape(ctx: EditorContext, e: PointerInput): boolean {
  const shape = singleSelected(ctx);
  if (!shape) return false;
  const p: Position = [e.x, e.y];
  const handle = handleAt(shape, p, e.toleranceUm);
  if (handle && e.alt && handle.type === "vertex" && hasFreeVertices(shape.kind)) {
    removeVertexAt(ctx, shape, handle.index);
    return true;
  }
  if (handle?.type === "corner") {
    ctx.transition(resizing(ctx, shape, handle, e));
    return true;
  }
  if (handle) {
    ctx.transition(vertexDragging(ctx, shape, handle.index, e));
    return true;
  }
  return e.alt && hasFreeVertices(shape.kind) && insertVertex(ctx, shape, p, e.toleranceUm);
}

/** The select tool at rest: hovering highlights, a press starts pointing at a shape, a handle or empty space. */
export function selectIdle(ctx: EditorContext): ToolState {
  return {
    name: "select.idle",
    pointerMove(e) {
      ctx.setHover(shapeAt(ctx.shapes().values(), [e.x, e.y], e.toleranceUm)?.id ?? null);
    },
    pointerDown(e) {
      if (ctx.canEdit && pressOnSelectedShape(ctx, e)) return;
      const hits = hitsAt(ctx.shapes().values(), [e.x, e.y], e.toleranceUm);
      if (hits.length === 0) {
        ctx.transition(pointingCanvas(ctx, e));
        return;
      }
      // A drag that starts on any selected shape moves the selection, even where a smaller
      // unselected shape lies on top of it (a pad inside a selected block).
      const selection = ctx.selection();
      const onSelection = hits.some((h) => selection.has(h.shape.id));
      ctx.transition(
        pointingShape(
          ctx,
          hits.map((h) => h.shape),
          onSelection,
          e,
        ),
      );
    },
  };
}
