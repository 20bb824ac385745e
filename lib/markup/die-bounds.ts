import type { Geometry, Position } from "@/lib/geometry/types";

/** Where markup of a die may lie, in die µm. */
export type DieBounds = { readonly minX: number; readonly minY: number; readonly maxX: number; readonly maxY: number };

/**
 * Bound on any coordinate when the die size is not known: ±200 mm, beyond any wafer, so only
 * absurd values (1e12, typos of many orders of magnitude) are refused.
 */
export const UNKNOWN_DIE_LIMIT_UM = 200_000;

/** Smallest margin around a die: room for notes and rulers beside a small die. */
const MIN_MARGIN_UM = 500;

/** Margin as a fraction of the die's size along the same axis. */
const MARGIN_FRACTION = 0.25;

function axis(size: number | null): [number, number] {
  if (size === null || !(size > 0)) return [-UNKNOWN_DIE_LIMIT_UM, UNKNOWN_DIE_LIMIT_UM];
  const margin = Math.max(MARGIN_FRACTION * size, MIN_MARGIN_UM);
  return [-margin, size + margin];
}

/**
 * The area markup may occupy: the die rectangle [0, width] × [0, height] widened on every side
 * by 25 % of the die's size along that axis, at least 500 µm, so notes, rulers and the start of
 * a wire bond can sit just off the die. An axis of unknown size gets ±200,000 µm.
 */
export function dieBounds(die: { readonly widthUm: number | null; readonly heightUm: number | null }): DieBounds {
  const [minX, maxX] = axis(die.widthUm);
  const [minY, maxY] = axis(die.heightUm);
  return { minX, minY, maxX, maxY };
}

function inside(p: Position, b: DieBounds): boolean {
  return p[0] >= b.minX && p[0] <= b.maxX && p[1] >= b.minY && p[1] <= b.maxY;
}

/**
 * The path (below `geometry`) of the first position outside the bounds, e.g.
 * `["coordinates", 0, 3]` for the fourth vertex of a polygon's outer ring; null when all are inside.
 */
export function firstPositionOutside(geometry: Geometry, bounds: DieBounds): (string | number)[] | null {
  switch (geometry.type) {
    case "Point":
      return inside(geometry.coordinates, bounds) ? null : ["coordinates"];
    case "LineString": {
      const i = geometry.coordinates.findIndex((p) => !inside(p, bounds));
      return i < 0 ? null : ["coordinates", i];
    }
    case "Polygon":
      for (let r = 0; r < geometry.coordinates.length; r++) {
        const i = geometry.coordinates[r].findIndex((p) => !inside(p, bounds));
        if (i >= 0) return ["coordinates", r, i];
      }
      return null;
  }
}

/** The bounds in words, for messages: "x −600…3000 µm, y −500…2100 µm". */
export function describeBounds(b: DieBounds): string {
  return `x ${b.minX}…${b.maxX} µm, y ${b.minY}…${b.maxY} µm`;
}
