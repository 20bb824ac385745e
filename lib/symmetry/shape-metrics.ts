/**
 * Centres and sizes of markup geometry. The centre is the area centroid of a polygon, the
 * length-weighted centroid of a line and the point itself: all three move with the shape
 * under any reflection or rotation (a bounding-box centre would not under a slanted axis).
 */
import type { Geometry, Position } from "../geometry/types";

type Box = { minX: number; minY: number; maxX: number; maxY: number };

/** Signed area and area centroid of a ring (shoelace formula). */
function ringMoments(ring: readonly Position[]): { area: number; cx: number; cy: number } {
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i + 1 < ring.length; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[i + 1];
    const cross = x0 * y1 - x1 * y0;
    a += cross;
    cx += (x0 + x1) * cross;
    cy += (y0 + y1) * cross;
  }
  a /= 2;
  return a === 0 ? { area: 0, cx: 0, cy: 0 } : { area: a, cx: cx / (6 * a), cy: cy / (6 * a) };
}

/** Mean of the distinct vertices, for degenerate (zero-area or zero-length) shapes. */
function vertexMean(points: readonly Position[]): [number, number] {
  const closed = points.length > 1 && points[0][0] === points.at(-1)![0] && points[0][1] === points.at(-1)![1];
  const pts = closed ? points.slice(0, -1) : points;
  const sx = pts.reduce((s, p) => s + p[0], 0);
  const sy = pts.reduce((s, p) => s + p[1], 0);
  return [sx / pts.length, sy / pts.length];
}

/** Length-weighted centroid of a polyline. */
function lineCentroid(points: readonly Position[]): [number, number] {
  let total = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i + 1 < points.length; i++) {
    const len = Math.hypot(points[i + 1][0] - points[i][0], points[i + 1][1] - points[i][1]);
    total += len;
    sx += (len * (points[i][0] + points[i + 1][0])) / 2;
    sy += (len * (points[i][1] + points[i + 1][1])) / 2;
  }
  return total === 0 ? vertexMean(points) : [sx / total, sy / total];
}

/** Centre of a geometry in die µm (holes are subtracted from a polygon's exterior). */
export function shapeCentre(geometry: Geometry): [number, number] {
  if (geometry.type === "Point") return [geometry.coordinates[0], geometry.coordinates[1]];
  if (geometry.type === "LineString") return lineCentroid(geometry.coordinates);
  const [outer, ...holes] = geometry.coordinates.map(ringMoments);
  let area = Math.abs(outer.area);
  let sx = area * outer.cx;
  let sy = area * outer.cy;
  for (const h of holes) {
    area -= Math.abs(h.area);
    sx -= Math.abs(h.area) * h.cx;
    sy -= Math.abs(h.area) * h.cy;
  }
  return area > 0 ? [sx / area, sy / area] : vertexMean(geometry.coordinates[0]);
}

/** Axis-aligned bounding box. */
export function boundingBox(geometry: Geometry): Box {
  const pts: readonly Position[] =
    geometry.type === "Point" ? [geometry.coordinates] : geometry.type === "LineString" ? geometry.coordinates : geometry.coordinates.flat();
  const box = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  for (const [x, y] of pts) {
    box.minX = Math.min(box.minX, x);
    box.minY = Math.min(box.minY, y);
    box.maxX = Math.max(box.maxX, x);
    box.maxY = Math.max(box.maxY, y);
  }
  return box;
}

/** Path length of a line (or of a polygon's outer ring); 0 for a point. */
export function pathLength(geometry: Geometry): number {
  const pts = geometry.type === "Point" ? [] : geometry.type === "LineString" ? geometry.coordinates : geometry.coordinates[0];
  let len = 0;
  for (let i = 0; i + 1 < pts.length; i++) len += Math.hypot(pts[i + 1][0] - pts[i][0], pts[i + 1][1] - pts[i][1]);
  return len;
}
