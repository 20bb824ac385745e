import { closeRing, distancePointToSegment, normaliseRing, openRing } from "@/lib/geometry/measure";
import type { LineStringGeometry, PolygonGeometry, Position } from "@/lib/geometry/types";
import type { MarkupKind } from "@/lib/markup/types";

type Editable = LineStringGeometry | PolygonGeometry;

/**
 * Fewest vertices each kind may keep when vertices are removed; kinds that are not listed have
 * a fixed vertex count (a wire bond and a symmetry axis are two-point lines, pads and die
 * outlines rectangles).
 */
export const MIN_VERTICES: Partial<Record<MarkupKind, number>> = { block: 3, trace: 2, ruler: 2 };

/** True when alt+click may add and remove vertices of this kind. */
export function hasFreeVertices(kind: MarkupKind): boolean {
  return MIN_VERTICES[kind] !== undefined;
}

/** The vertices a user edits: a line's positions, or a polygon's outer ring without its closing repeat. */
export function editableVertices(geometry: Editable): Position[] {
  return geometry.type === "LineString" ? [...geometry.coordinates] : openRing(geometry.coordinates[0]);
}

/** The geometry with its editable vertices replaced (a polygon keeps its holes and is re-closed). */
function withVertices<G extends Editable>(geometry: G, vertices: readonly Position[]): G {
  if (geometry.type === "LineString") return { ...geometry, coordinates: [...vertices] };
  const [, ...holes] = geometry.coordinates;
  return { ...geometry, coordinates: [closeRing(vertices), ...holes] };
}

/** The geometry with one vertex moved. */
export function moveVertex<G extends Editable>(geometry: G, index: number, to: Position): G {
  const vertices = editableVertices(geometry);
  if (index < 0 || index >= vertices.length) throw new RangeError(`no vertex ${index}`);
  vertices[index] = to;
  return withVertices(geometry, vertices);
}

/** Closest point of segment a–b to p. */
function projectOnSegment(p: Position, a: Position, b: Position): Position {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const lengthSquared = dx * dx + dy * dy;
  if (lengthSquared === 0) return a;
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared));
  return [a[0] + t * dx, a[1] + t * dy];
}

/**
 * Adds a vertex on the edge nearest the point, when that edge is within the tolerance. The new
 * vertex is the point's projection onto the edge, so the outline does not change until it is
 * dragged. Returns the geometry and the new vertex's index, or null when no edge is near.
 */
export function insertVertexNear<G extends Editable>(geometry: G, p: Position, toleranceUm: number): { geometry: G; index: number } | null {
  const vertices = editableVertices(geometry);
  const edgeCount = geometry.type === "Polygon" ? vertices.length : vertices.length - 1;
  let best = -1;
  let bestDistance = Infinity;
  for (let i = 0; i < edgeCount; i++) {
    const d = distancePointToSegment(p, vertices[i], vertices[(i + 1) % vertices.length]);
    if (d < bestDistance) [best, bestDistance] = [i, d];
  }
  if (best < 0 || bestDistance > toleranceUm) return null;
  const at = projectOnSegment(p, vertices[best], vertices[(best + 1) % vertices.length]);
  vertices.splice(best + 1, 0, at);
  return { geometry: withVertices(geometry, vertices), index: best + 1 };
}

/** The geometry without one vertex, or null when that would leave fewer than `minimum`. */
export function removeVertex<G extends Editable>(geometry: G, index: number, minimum: number): G | null {
  const vertices = editableVertices(geometry);
  if (index < 0 || index >= vertices.length || vertices.length <= minimum) return null;
  vertices.splice(index, 1);
  return withVertices(geometry, vertices);
}

/** A polygon with its outer ring normalised for storage (closed, counter-clockwise, no repeats). */
export function normalisedPolygon(geometry: PolygonGeometry): PolygonGeometry {
  const [outer, ...holes] = geometry.coordinates;
  return { ...geometry, coordinates: [normaliseRing(outer, "ccw"), ...holes] };
}
