import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { hitsAt, shapeAt } from "../../hit-test";
import { clickedShape } from "./pointing-shape";
import { withGeometry, withProperties } from "../../model";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";
import { editableVertices, moveVertex, normalisedPolygon } from "../../vertices";

/**
 * Dragging one vertex of a line or polygon. A wire bond's first vertex is its foot: while it is
 * dragged the bond is unattached, and on release it attaches to the pad it was dropped on
 * (snapping to that pad's centre) or stays unattached. A bond never changes its pad silently:
 * moving to another pad or coming off one says so (one undo step puts it back). Polygons are
 * re-oriented on release.
 */
const padName = (pad: AnyShape | null | undefined) => (pad && pad.kind === "pad" ? pad.properties.label || "(no label)" : "");

/** What to tell the user when a bond's foot lands on another pad or on none; null when its pad stays. */
function padChangeMessage(ctx: EditorContext, bond: AnyShape, to: AnyShape | null): string | null {
  const fromId = bond.kind === "wire_bond" ? (bond.properties.padId ?? null) : null;
  const toId = to?.id ?? null;
  if (fromId === toId) return null;
  const from = fromId ? ctx.shapes().get(fromId) : null;
  if (to && from) return `Wire bond moved from pad ${padName(from)} to pad ${padName(to)}. Undo (Ctrl+Z) puts it back.`;
  if (to) return `Wire bond attached to pad ${padName(to)}.`;
  return `Wire bond detached from pad ${padName(from)}: its foot no longer follows the pad. Undo (Ctrl+Z) puts it back.`;
}

export function vertexDragging(ctx: EditorContext, shape: AnyShape, index: number, down: PointerInput): ToolState {
  const geometry = shape.geometry;
  if (geometry.type === "Point") throw new TypeError("a point has no vertices");
  const start = editableVertices(geometry)[index];
  const offset: Position = [start[0] - down.x, start[1] - down.y];
  const isFoot = shape.kind === "wire_bond" && index === 0;
  const live = ctx.beginLiveEdit();
  const moved = (e: PointerInput): AnyShape => {
    const now = ctx.stamp.now();
    const next = withGeometry(shape, moveVertex(geometry, index, [e.x + offset[0], e.y + offset[1]]), now);
    return isFoot ? withProperties(next, { padId: null }, now) : next;
  };
  let dragged = false;
  return {
    name: "select.vertex_dragging",
    interacting: true,
    pointerMove(e) {
      if (!dragged && Math.hypot(e.x - down.x, e.y - down.y) <= e.toleranceUm) return;
      dragged = true;
      live.set([moved(e)]);
    },
    pointerUp(e) {
      if (!dragged && Math.hypot(e.x - down.x, e.y - down.y) <= e.toleranceUm) {
        // A click on a handle: nothing moves, and it selects like any click (cycling the stack).
        live.cancel();
        const stack = hitsAt(ctx.shapes().values(), [down.x, down.y], down.toleranceUm).map((h) => h.shape);
        if (stack.length > 0) ctx.setSelection([clickedShape(ctx, stack, down).id]);
        ctx.toIdle();
        return;
      }
      let final = moved(e);
      const now = ctx.stamp.now();
      let message: string | null = null;
      if (isFoot) {
        const pad = shapeAt(ctx.shapes().values(), [e.x + offset[0], e.y + offset[1]], e.toleranceUm, (s) => s.kind === "pad");
        if (pad) final = withProperties(final, { padId: pad.id }, now);
        message = padChangeMessage(ctx, shape, pad);
      }
      if (final.geometry.type === "Polygon") final = withGeometry(final, normalisedPolygon(final.geometry), now);
      live.set([final]);
      const entry = live.commit();
      if (message && entry.length > 0) ctx.notify(message);
      ctx.toIdle();
    },
    cancel() {
      live.cancel();
    },
  };
}
