import type { PolygonGeometry, Position } from "../geometry/types";
import type { PadInput, PadState } from "./types";

/** Axis-aligned rectangle polygon centred on (cx, cy), closed counter-clockwise. Test use only. */
export function rect(cx: number, cy: number, w: number, h: number): PolygonGeometry {
  const [x0, x1, y0, y1] = [cx - w / 2, cx + w / 2, cy - h / 2, cy + h / 2];
  return {
    type: "Polygon",
    coordinates: [
      [
        [x0, y0],
        [x1, y0],
        [x1, y1],
        [x0, y1],
        [x0, y0],
      ],
    ],
  };
}

/** A pad of the invented demo die. Test use only. */
export function pad(id: string, cx: number, cy: number, extra: Partial<PadInput["properties"]> = {}, w = 80, h = 80): PadInput {
  return {
    id,
    geometry: rect(cx, cy, w, h),
    properties: { label: id.toUpperCase(), net: `net_${id}`, state: "bonded" as PadState, ...extra },
  };
}

/** The demo die outline, 2400 µm × 1600 µm from the origin. */
export const DIE_OUTLINE: PolygonGeometry = rect(1200, 800, 2400, 1600);

/** Rotates a polygon by deg about `about` and shifts it. Test use only. */
export function rotatePolygon(p: PolygonGeometry, deg: number, about: Position, shift: Position): PolygonGeometry {
  const c = Math.cos((deg * Math.PI) / 180);
  const s = Math.sin((deg * Math.PI) / 180);
  return {
    type: "Polygon",
    coordinates: p.coordinates.map((ring) =>
      ring.map(([x, y]): Position => {
        const dx = x - about[0];
        const dy = y - about[1];
        return [about[0] + c * dx - s * dy + shift[0], about[1] + s * dx + c * dy + shift[1]];
      }),
    ),
  };
}
