import type { PolygonGeometry, Position } from "@/lib/geometry/types";

/**
 * The rectangle closest to four detected die corners (counter-clockwise from the lower-left, y
 * up), as a die outline: the die frame needs an exact rectangle, and detected corners are a
 * few µm off one. Its direction is the mean of the two edges along x and the two along y
 * (the y edges turned back by a quarter turn), its sides the mean lengths of opposite edges,
 * its centre the corners' mean. Ring closed and counter-clockwise from the lower-left.
 */
export function outlineFromCorners(corners: readonly Position[]): PolygonGeometry {
  if (corners.length !== 4) throw new RangeError("a die outline needs four corners");
  const [a, b, c, d] = corners;
  const sub = (p: Position, q: Position): [number, number] => [p[0] - q[0], p[1] - q[1]];
  const len = (v: readonly number[]) => Math.hypot(v[0], v[1]);
  const bottom = sub(b, a);
  const top = sub(c, d);
  const right = sub(c, b);
  const left = sub(d, a);
  // Edges along y turned by −90° point along x: (x, y) → (y, −x).
  const dir = [bottom[0] + top[0] + right[1] + left[1], bottom[1] + top[1] - right[0] - left[0]];
  const n = len(dir);
  if (!(n > 0)) throw new RangeError("the corners do not span a rectangle");
  const ex = [dir[0] / n, dir[1] / n];
  const ey = [-ex[1], ex[0]];
  const w = (len(bottom) + len(top)) / 2;
  const h = (len(right) + len(left)) / 2;
  const cx = (a[0] + b[0] + c[0] + d[0]) / 4;
  const cy = (a[1] + b[1] + c[1] + d[1]) / 4;
  const at = (sx: number, sy: number): Position => [cx + (sx * w * ex[0] + sy * h * ey[0]) / 2, cy + (sx * w * ex[1] + sy * h * ey[1]) / 2];
  const ring = [at(-1, -1), at(1, -1), at(1, 1), at(-1, 1)];
  return { type: "Polygon", coordinates: [[...ring, ring[0]]] };
}
