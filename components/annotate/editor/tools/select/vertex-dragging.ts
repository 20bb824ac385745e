import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { shapeAt } from "../../hit-test";
import { withGeometry, withProperties } from "../../model";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PointerInput } from "../../types";
import { editableVertices, moveVertex, normalisedPolygon } from "../../vertices";

/**
 * Dragging one vertex of a line or polygon. A wire bond's first vertex is its foot: while it is
 * dragged the bond is unattached, and on release it attaches to the pad it was dropped on
 * (snapping to that pad's centre) or stays unattached. Polygons are re-oriented on release.
 */
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
  return {
    name: "select.vertex_dragging",
    interacting: true,
    pointerMove(e) {
      live.set([moved(e)]);
    },
    pointerUp(e) {
      let final = moved(e);
      const now = ctx.stamp.now();
      if (isFoot) {
        const pad = shapeAt(ctx.shapes().values(), [e.x + offset[0], e.y + offset[1]], e.toleranceUm, (s) => s.kind === "pad");
        if (pad) final = withProperties(final, { padId: pad.id }, now);
      }
      if (final.geometry.type === "Polygon") final = withGeometry(final, normalisedPolygon(final.geometry), now);
      live.set([final]);
      live.commit();
      ctx.toIdle();
    },
    cancel() {
      live.cancel();
    },
  };
}
