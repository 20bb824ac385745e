/** Builders of markup shapes for this folder's tests (not shipped in the app bundle). */
import type { Position } from "../geometry/types";
import type { AnyShape } from "../markup/types";

let serial = 0;

/** A shape as the API returns it, with a fresh id. */
export function shapeOf(kind: AnyShape["kind"], geometry: AnyShape["geometry"], properties: Record<string, unknown> = {}): AnyShape {
  serial++;
  return { id: `shape-${serial}`, kind, geometry, properties, version: 1, createdBy: null, updatedAt: "2024-05-02T10:00:00.000Z" } as AnyShape;
}

/** A closed axis-aligned rectangle ring. */
export function rectRing(x0: number, y0: number, x1: number, y1: number): Position[] {
  return [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
    [x0, y0],
  ];
}
