import { boundingBox, distancePointToSegment, polygonArea, type BoundingBox } from "@/lib/geometry/measure";
import type { Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { boxInside } from "./rectangle";

/** One shape under the pointer: how far its drawn outline is, and how big it is. */
export type Hit = { readonly shape: AnyShape; readonly distance: number; readonly size: number; readonly order: number };

/** Even-odd crossing test; points exactly on an edge may fall either way (edges are hit by distance). */
export function pointInRing(p: Position, ring: readonly Position[]): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Shortest distance from a point to a path of segments (closed: the last vertex joins the first). */
export function distanceToPath(p: Position, path: readonly Position[], closed: boolean): number {
  if (path.length === 1) return Math.hypot(p[0] - path[0][0], p[1] - path[0][1]);
  let best = Infinity;
  for (let i = 1; i < path.length; i++) best = Math.min(best, distancePointToSegment(p, path[i - 1], path[i]));
  if (closed && path.length > 2) best = Math.min(best, distancePointToSegment(p, path[path.length - 1], path[0]));
  return best;
}

/** Half the drawn width of lines that have a physical width (traces, bond wires), in µm. */
function halfWidth(shape: AnyShape): number {
  if (shape.kind === "trace") return Math.max(0, shape.properties.widthUm) / 2;
  if (shape.kind === "wire_bond") return Math.max(0, shape.properties.diameterUm) / 2;
  return 0;
}

/**
 * Distance from the pointer to a shape as it is drawn, or null when farther than the tolerance.
 * Points and lines are hit by distance; filled polygons also anywhere inside (0). The die
 * outline is a frame, hit only near its edge, so a click or box selection inside the die still
 * reaches the shapes on it.
 */
export function hitDistance(shape: AnyShape, p: Position, toleranceUm: number): number | null {
  const g = shape.geometry;
  let distance: number;
  if (g.type === "Point") distance = distanceToPath(p, [g.coordinates], false);
  else if (g.type === "LineString") distance = Math.max(0, distanceToPath(p, g.coordinates, false) - halfWidth(shape));
  else {
    const [outer, ...holes] = g.coordinates;
    const inside = shape.kind !== "die_outline" && pointInRing(p, outer) && !holes.some((h) => pointInRing(p, h));
    distance = inside ? 0 : Math.min(...g.coordinates.map((ring) => distanceToPath(p, ring, true)));
  }
  return distance <= toleranceUm ? distance : null;
}

/** Area for polygons, 0 for points and lines: what "smaller" means when several shapes are hit. */
function shapeSize(shape: AnyShape): number {
  return shape.geometry.type === "Polygon" ? polygonArea(shape.geometry) : 0;
}

/**
 * Every shape under the pointer, best first: smaller shapes before larger ones (a pad before
 * the block around it), then nearer, then the one drawn on top; a pad under the pointer before
 * the wire bonds attached to it.
 */
export function hitsAt(shapes: Iterable<AnyShape>, p: Position, toleranceUm: number, accept: (shape: AnyShape) => boolean = () => true): Hit[] {
  const hits: Hit[] = [];
  let order = 0;
  for (const shape of shapes) {
    order++;
    if (!accept(shape)) continue;
    const distance = hitDistance(shape, p, toleranceUm);
    if (distance !== null) hits.push({ shape, distance, size: shapeSize(shape), order });
  }
  hits.sort((a, b) => a.size - b.size || a.distance - b.distance || b.order - a.order);
  return padsBeforeTheirBonds(hits);
}

/**
 * A wire bond starts at its pad's centre, so a press inside a pad also hits the bond's foot;
 * the bond (a line, size 0) would win. What the user means there is the pad: a pad the pointer
 * is inside goes before its own bonds. The bond stays reachable on its wire outside the pad,
 * or by clicking again at the same spot (the select tool cycles through the stack).
 */
function padsBeforeTheirBonds(hits: Hit[]): Hit[] {
  for (const padHit of hits.filter((h) => h.shape.kind === "pad" && h.distance === 0)) {
    const padAt = hits.indexOf(padHit);
    const firstBond = hits.findIndex((h) => h.shape.kind === "wire_bond" && h.shape.properties.padId === padHit.shape.id);
    if (firstBond >= 0 && firstBond < padAt) {
      hits.splice(padAt, 1);
      hits.splice(firstBond, 0, padHit);
    }
  }
  return hits;
}

/** The best shape under the pointer, or null. */
export function shapeAt(shapes: Iterable<AnyShape>, p: Position, toleranceUm: number, accept?: (shape: AnyShape) => boolean): AnyShape | null {
  return hitsAt(shapes, p, toleranceUm, accept)[0]?.shape ?? null;
}

/** Ids of the shapes whose bounding box lies entirely inside the box, in drawing order. */
export function shapesInBox(shapes: Iterable<AnyShape>, box: BoundingBox): string[] {
  const ids: string[] = [];
  for (const shape of shapes) if (boxInside(boundingBox(shape.geometry), box)) ids.push(shape.id);
  return ids;
}
