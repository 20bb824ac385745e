import type { BoundingBox } from "@/lib/geometry/measure";
import type { PolygonGeometry, Position } from "@/lib/geometry/types";

/** The box spanned by two opposite corners, whichever way round they are. */
export function boxFromCorners(a: Position, b: Position): BoundingBox {
  return { minX: Math.min(a[0], b[0]), minY: Math.min(a[1], b[1]), maxX: Math.max(a[0], b[0]), maxY: Math.max(a[1], b[1]) };
}

/** Width and height of a box. */
export function boxSize(box: BoundingBox): { width: number; height: number } {
  return { width: box.maxX - box.minX, height: box.maxY - box.minY };
}

/**
 * An axis-aligned rectangle as a closed ring, counter-clockwise in the y-up die frame (RFC 7946
 * outer rings), starting at the lower-left corner.
 */
export function rectangleGeometry(box: BoundingBox): PolygonGeometry {
  const { minX, minY, maxX, maxY } = box;
  return {
    type: "Polygon",
    coordinates: [
      [
        [minX, minY],
        [maxX, minY],
        [maxX, maxY],
        [minX, maxY],
        [minX, minY],
      ],
    ],
  };
}

/** A rectangle of the given size centred on a point. */
export function rectangleAround(centre: Position, width: number, height: number): PolygonGeometry {
  return rectangleGeometry({
    minX: centre[0] - width / 2,
    minY: centre[1] - height / 2,
    maxX: centre[0] + width / 2,
    maxY: centre[1] + height / 2,
  });
}

/**
 * The box when a polygon is exactly an axis-aligned rectangle (one ring of four distinct
 * corners, each edge horizontal or vertical), else null: only such shapes get corner handles.
 */
export function axisAlignedBox(polygon: PolygonGeometry): BoundingBox | null {
  if (polygon.coordinates.length !== 1) return null;
  const ring = polygon.coordinates[0];
  const open = ring.length === 5 && ring[0][0] === ring[4][0] && ring[0][1] === ring[4][1] ? ring.slice(0, 4) : null;
  if (!open) return null;
  for (let i = 0; i < 4; i++) {
    const a = open[i];
    const b = open[(i + 1) % 4];
    if (a[0] !== b[0] && a[1] !== b[1]) return null;
  }
  const box = boxFromCorners(open[0], open[2]);
  const { width, height } = boxSize(box);
  return width > 0 && height > 0 ? box : null;
}

/** True when a box lies entirely inside another (edges may touch). */
export function boxInside(inner: BoundingBox, outer: BoundingBox): boolean {
  return inner.minX >= outer.minX && inner.maxX <= outer.maxX && inner.minY >= outer.minY && inner.maxY <= outer.maxY;
}
