import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { withGeometry } from "../../model";
import type { EditorContext } from "../../tool-state";
import { insertVertexNear, MIN_VERTICES, normalisedPolygon, removeVertex } from "../../vertices";

/** Alt+click on a vertex: removes it unless the shape would drop below its kind's minimum. */
export function removeVertexAt(ctx: EditorContext, shape: AnyShape, index: number): void {
  const g = shape.geometry;
  const minimum = MIN_VERTICES[shape.kind];
  if (g.type === "Point" || minimum === undefined) return;
  const next = removeVertex(g, index, minimum);
  if (!next) return;
  const geometry = next.type === "Polygon" ? normalisedPolygon(next) : next;
  ctx.commit([{ before: shape, after: withGeometry(shape, geometry, ctx.stamp.now()) }]);
}

/** Alt+click on an edge: adds a vertex there. True when an edge was near enough. */
export function insertVertex(ctx: EditorContext, shape: AnyShape, p: Position, toleranceUm: number): boolean {
  const g = shape.geometry;
  if (g.type === "Point") return false;
  const inserted = insertVertexNear(g, p, toleranceUm);
  if (!inserted) return false;
  ctx.commit([{ before: shape, after: withGeometry(shape, inserted.geometry, ctx.stamp.now()) }]);
  return true;
}
