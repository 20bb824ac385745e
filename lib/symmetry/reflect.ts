/**
 * Reflection across an arbitrary line in the die plane. For a line through a with unit
 * direction d, the mirror image of p is 2·(a + ((p − a)·d)·d) − p.
 */
import type { Geometry, Position } from "../geometry/types";
import { SymmetryInputError, type SymmetryAxis } from "./types";

/** The axis as a point and a unit direction. */
export type AxisLine = { readonly ox: number; readonly oy: number; readonly dx: number; readonly dy: number };

/** Checks the axis (two distinct finite points) and returns it as point + unit direction. */
export function axisLine(axis: SymmetryAxis): AxisLine {
  const pts = axis?.type === "LineString" ? axis.coordinates : undefined;
  if (!pts || pts.length !== 2 || !pts.flat().every(Number.isFinite)) {
    throw new SymmetryInputError("axis must be a LineString of two finite points");
  }
  const [[x0, y0], [x1, y1]] = pts;
  const len = Math.hypot(x1 - x0, y1 - y0);
  if (len === 0) throw new SymmetryInputError("axis points must be distinct");
  return { ox: x0, oy: y0, dx: (x1 - x0) / len, dy: (y1 - y0) / len };
}

/** Mirror image of a point across the axis line. */
export function reflectPoint(p: Position, line: AxisLine): [number, number] {
  const t = (p[0] - line.ox) * line.dx + (p[1] - line.oy) * line.dy;
  const fx = line.ox + t * line.dx;
  const fy = line.oy + t * line.dy;
  return [2 * fx - p[0], 2 * fy - p[1]];
}

/** Signed distance from the axis: positive on the left of the axis direction. */
export function signedDistance(p: Position, line: AxisLine): number {
  return line.dx * (p[1] - line.oy) - line.dy * (p[0] - line.ox);
}

/**
 * Mirror image of a geometry across the axis, for the ghost outlines on the canvas.
 * A reflection reverses orientation, so polygon rings are reversed to keep their winding
 * (exterior counter-clockwise, RFC 7946) as it was.
 */
export function mirrorGeometry(geometry: Geometry, axis: SymmetryAxis | AxisLine): Geometry {
  const line = "dx" in axis ? axis : axisLine(axis);
  const m = (p: Position) => reflectPoint(p, line);
  switch (geometry.type) {
    case "Point":
      return { type: "Point", coordinates: m(geometry.coordinates) };
    case "LineString":
      return { type: "LineString", coordinates: geometry.coordinates.map(m) };
    case "Polygon":
      return { type: "Polygon", coordinates: geometry.coordinates.map((ring) => ring.map(m).reverse()) };
  }
}
