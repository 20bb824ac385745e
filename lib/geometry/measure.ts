import type { Geometry, PolygonGeometry, Position } from "./types";

/** Axis-aligned bounding box in die µm. */
export type BoundingBox = { readonly minX: number; readonly minY: number; readonly maxX: number; readonly maxY: number };

/** Sum of the segment lengths of an open or closed sequence of positions. */
export function polylineLength(positions: readonly Position[]): number {
  let total = 0;
  for (let i = 1; i < positions.length; i++) {
    total += Math.hypot(positions[i][0] - positions[i - 1][0], positions[i][1] - positions[i - 1][1]);
  }
  return total;
}

/**
 * Shoelace area of one ring, positive when counter-clockwise in a y-up frame (the die frame).
 * Accepts closed or open rings: the closing edge is implied either way.
 */
export function signedRingArea(ring: readonly Position[]): number {
  const n = ring.length;
  if (n < 3) return 0;
  // Offsetting by the first vertex keeps the cross products small, which avoids cancellation
  // for rings far from the origin (a pad at x = 2400 µm with 0.1 µm detail).
  const [ox, oy] = ring[0];
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const [x1, y1] = ring[i];
    const [x2, y2] = ring[(i + 1) % n];
    twice += (x1 - ox) * (y2 - oy) - (x2 - ox) * (y1 - oy);
  }
  return twice / 2;
}

/** Absolute area of one ring. */
export function ringArea(ring: readonly Position[]): number {
  return Math.abs(signedRingArea(ring));
}

/** Area of a polygon: its outer ring less its holes, whatever their orientation. */
export function polygonArea(polygon: PolygonGeometry): number {
  const [outer, ...holes] = polygon.coordinates;
  if (!outer) return 0;
  return holes.reduce((area, hole) => area - ringArea(hole), ringArea(outer));
}

/** Area-weighted centroid of one ring, with its signed area; null when the ring has no area. */
function ringMoments(ring: readonly Position[]): { area: number; cx: number; cy: number } | null {
  const n = ring.length;
  if (n < 3) return null;
  const [ox, oy] = ring[0];
  let twice = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    const x1 = ring[i][0] - ox;
    const y1 = ring[i][1] - oy;
    const x2 = ring[(i + 1) % n][0] - ox;
    const y2 = ring[(i + 1) % n][1] - oy;
    const cross = x1 * y2 - x2 * y1;
    twice += cross;
    sx += (x1 + x2) * cross;
    sy += (y1 + y2) * cross;
  }
  if (twice === 0) return null;
  return { area: twice / 2, cx: ox + sx / (3 * twice), cy: oy + sy / (3 * twice) };
}

/**
 * Centroid (centre of area) of a polygon with holes. A polygon without area (all vertices on
 * a line) falls back to the mean of its distinct vertices so a degenerate pad still has a centre.
 */
export function polygonCentroid(polygon: PolygonGeometry): Position {
  const [outer, ...holes] = polygon.coordinates;
  if (!outer || outer.length === 0) throw new RangeError("polygon has no outer ring");
  const outerMoments = ringMoments(outer);
  if (!outerMoments) return meanPosition(openRing(outer));
  let area = Math.abs(outerMoments.area);
  let mx = area * outerMoments.cx;
  let my = area * outerMoments.cy;
  for (const hole of holes) {
    const m = ringMoments(hole);
    if (!m) continue;
    const a = Math.abs(m.area);
    area -= a;
    mx -= a * m.cx;
    my -= a * m.cy;
  }
  if (area <= 0) return [outerMoments.cx, outerMoments.cy];
  return [mx / area, my / area];
}

/** Bounding box of a list of positions; throws on an empty list. */
export function boundingBoxOf(positions: readonly Position[]): BoundingBox {
  if (positions.length === 0) throw new RangeError("no positions");
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const [x, y] of positions) {
    if (x < minX) minX = x;
    if (y < minY) minY = y;
    if (x > maxX) maxX = x;
    if (y > maxY) maxY = y;
  }
  return { minX, minY, maxX, maxY };
}

/** All positions of a geometry, rings flattened (closing repeats included). */
function geometryPositions(geometry: Geometry): readonly Position[] {
  switch (geometry.type) {
    case "Point":
      return [geometry.coordinates];
    case "LineString":
      return geometry.coordinates;
    case "Polygon":
      return geometry.coordinates.flat();
  }
}

/** Bounding box of any geometry. */
export function boundingBox(geometry: Geometry): BoundingBox {
  return boundingBoxOf(geometryPositions(geometry));
}

/**
 * Centre of any geometry: a point is its own centre, a polygon its centre of area, a line its
 * centre of length (each segment weighted by its length, as for a uniform wire). A line of zero
 * length falls back to its first position.
 */
export function geometryCentre(geometry: Geometry): Position {
  if (geometry.type === "Point") return geometry.coordinates;
  if (geometry.type === "Polygon") return polygonCentroid(geometry);
  const pts = geometry.coordinates;
  if (pts.length === 0) throw new RangeError("line has no positions");
  let total = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 1; i < pts.length; i++) {
    const len = Math.hypot(pts[i][0] - pts[i - 1][0], pts[i][1] - pts[i - 1][1]);
    total += len;
    sx += (len * (pts[i][0] + pts[i - 1][0])) / 2;
    sy += (len * (pts[i][1] + pts[i - 1][1])) / 2;
  }
  return total === 0 ? pts[0] : [sx / total, sy / total];
}

/** Shortest distance from point p to the segment a–b (to a itself when a = b). */
export function distancePointToSegment(p: Position, a: Position, b: Position): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const lengthSquared = dx * dx + dy * dy;
  if (lengthSquared === 0) return Math.hypot(p[0] - a[0], p[1] - a[1]);
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

function samePosition(a: Position, b: Position): boolean {
  return a[0] === b[0] && a[1] === b[1];
}

function meanPosition(positions: readonly Position[]): Position {
  const distinct = uniquePositions(positions);
  const sx = distinct.reduce((s, p) => s + p[0], 0);
  const sy = distinct.reduce((s, p) => s + p[1], 0);
  return [sx / distinct.length, sy / distinct.length];
}

function uniquePositions(positions: readonly Position[]): Position[] {
  const seen = new Set<string>();
  const out: Position[] = [];
  for (const p of positions) {
    const key = `${p[0]},${p[1]}`;
    if (!seen.has(key)) {
      seen.add(key);
      out.push(p);
    }
  }
  return out;
}

/** True when a ring repeats its first position at the end, as RFC 7946 requires. */
export function isRingClosed(ring: readonly Position[]): boolean {
  return ring.length > 1 && samePosition(ring[0], ring[ring.length - 1]);
}

/** Returns the ring with its first position repeated at the end (unchanged if already closed). */
export function closeRing(ring: readonly Position[]): Position[] {
  if (ring.length === 0 || isRingClosed(ring)) return [...ring];
  return [...ring, ring[0]];
}

/** Returns the ring without its closing repeat: one entry per vertex. */
export function openRing(ring: readonly Position[]): Position[] {
  return isRingClosed(ring) ? ring.slice(0, -1) : [...ring];
}

/**
 * Normalises a ring for storage: drops consecutive repeated positions (double clicks while
 * drawing), closes it, and orients it counter-clockwise (RFC 7946 §3.1.6 outer rings) or
 * clockwise (holes) in the y-up die frame.
 */
export function normaliseRing(ring: readonly Position[], orientation: "ccw" | "cw" = "ccw"): Position[] {
  const open = openRing(ring).filter((p, i, all) => i === 0 || !samePosition(p, all[i - 1]));
  while (open.length > 1 && samePosition(open[0], open[open.length - 1])) open.pop();
  const area = signedRingArea(open);
  const wantPositive = orientation === "ccw";
  // Reverse after the first vertex so the ring keeps its starting point.
  const oriented = area !== 0 && area > 0 !== wantPositive ? [open[0], ...open.slice(1).reverse()] : open;
  return closeRing(oriented);
}

/** Number of distinct vertices: repeated positions (including a ring's closing repeat) count once. */
export function distinctVertexCount(positions: readonly Position[]): number {
  return uniquePositions(positions).length;
}
