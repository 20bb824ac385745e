import { applyAffine } from "./affine";
import type { Affine2x3, Geometry, Position } from "./types";

function mapPosition(m: Affine2x3, p: Position): Position {
  return applyAffine(m, p[0], p[1]);
}

/**
 * Applies an affine transform to every position of a geometry, keeping its type.
 * A transform with negative determinant (a y flip) reverses ring orientation; callers that
 * store the result should re-orient rings (normaliseRing in ./measure).
 */
export function transformGeometry<G extends Geometry>(m: Affine2x3, geometry: G): G {
  switch (geometry.type) {
    case "Point":
      return { ...geometry, coordinates: mapPosition(m, geometry.coordinates) };
    case "LineString":
      return { ...geometry, coordinates: geometry.coordinates.map((p) => mapPosition(m, p)) };
    case "Polygon":
      return { ...geometry, coordinates: geometry.coordinates.map((ring) => ring.map((p) => mapPosition(m, p))) };
  }
}

/** Moves a geometry by (dx, dy) in its own units. */
export function translateGeometry<G extends Geometry>(geometry: G, dx: number, dy: number): G {
  return transformGeometry(
    [
      [1, 0, dx],
      [0, 1, dy],
    ],
    geometry,
  );
}
