import type { Geometry, Position } from "@/lib/geometry/types";
import { roundUm } from "./format-um";

/**
 * A geometry with every coordinate rounded to the decimals the scale resolves (see format-um.ts),
 * for files people read (GeoJSON export): 26.999981 becomes 27. A polygon ring stays closed,
 * since its first and last positions round alike.
 */
export function roundGeometryUm<G extends Geometry>(geometry: G, umPerPx?: number | null): G {
  const p = (q: Position): Position => [roundUm(q[0], umPerPx), roundUm(q[1], umPerPx)];
  switch (geometry.type) {
    case "Point":
      return { ...geometry, coordinates: p(geometry.coordinates) };
    case "LineString":
      return { ...geometry, coordinates: geometry.coordinates.map(p) };
    case "Polygon":
      return { ...geometry, coordinates: geometry.coordinates.map((ring) => ring.map(p)) };
  }
  return geometry;
}
