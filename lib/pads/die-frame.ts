import { normaliseRing, openRing } from "../geometry/measure";
import type { PolygonGeometry, Position } from "../geometry/types";
import { PadTableInputError } from "./pad-table-input-error";

/** The die outline's own axes: origin at its lower-left corner, unit x along its bottom edge. */
export type DieFrame = {
  readonly origin: Position;
  readonly ex: Position;
  readonly ey: Position;
  readonly widthUm: number;
  readonly heightUm: number;
  readonly rotationDeg: number;
};

/** Right angles and equal opposite sides must hold to this relative tolerance. */
const RECTANGLE_TOLERANCE = 1e-6;

function edgesOf(corners: readonly Position[]): Position[] {
  return corners.map((p, i): Position => {
    const q = corners[(i + 1) % corners.length];
    return [q[0] - p[0], q[1] - p[1]];
  });
}

function assertRectangle(edges: readonly Position[]): void {
  const lengths = edges.map(([x, y]) => Math.hypot(x, y));
  edges.forEach(([x, y], i) => {
    const [nx, ny] = edges[(i + 1) % 4];
    const cosine = (x * nx + y * ny) / (lengths[i] * lengths[(i + 1) % 4]);
    if (!(Math.abs(cosine) <= RECTANGLE_TOLERANCE)) throw new PadTableInputError("die outline corners are not right angles");
  });
  const longest = Math.max(...lengths);
  if (Math.abs(lengths[0] - lengths[2]) > RECTANGLE_TOLERANCE * longest || Math.abs(lengths[1] - lengths[3]) > RECTANGLE_TOLERANCE * longest) {
    throw new PadTableInputError("die outline opposite sides differ in length");
  }
}

/**
 * Reads a rectangular die outline, axis-aligned or rotated by any angle. Its bottom edge is the
 * edge whose direction (going counter-clockwise) is within (−45°, 45°] of the die frame's +x.
 */
export function dieFrameFromOutline(outline: PolygonGeometry): DieFrame {
  const outer = outline?.type === "Polygon" ? outline.coordinates[0] : undefined;
  if (!outer || !outer.flat().every(Number.isFinite)) throw new PadTableInputError("die outline must be a Polygon with finite coordinates");
  const corners = openRing(normaliseRing(outer, "ccw"));
  if (corners.length !== 4) throw new PadTableInputError(`die outline must be a rectangle; it has ${corners.length} corners`);
  const edges = edgesOf(corners);
  assertRectangle(edges);
  const angles = edges.map(([x, y]) => Math.atan2(y, x));
  const bottom = angles.findIndex((a) => a > -Math.PI / 4 && a <= Math.PI / 4);
  const [bx, by] = edges[bottom];
  const widthUm = Math.hypot(bx, by);
  const ex: Position = [bx / widthUm, by / widthUm];
  return {
    origin: corners[bottom],
    ex,
    ey: [-ex[1], ex[0]],
    widthUm,
    heightUm: Math.hypot(...edges[(bottom + 1) % 4]),
    rotationDeg: (angles[bottom] * 180) / Math.PI,
  };
}

/** Die-frame µm → the outline's own axes (from its lower-left corner). */
export function toOutlineAxes(frame: DieFrame, p: Position): Position {
  const dx = p[0] - frame.origin[0];
  const dy = p[1] - frame.origin[1];
  return [dx * frame.ex[0] + dy * frame.ex[1], dx * frame.ey[0] + dy * frame.ey[1]];
}
