import { distancePointToSegment } from "../geometry/measure";
import type { Position } from "../geometry/types";
import type { PadSide } from "./types";

/** Sides in counter-clockwise order from the top-left corner (die frame, y up). */
export const SIDES_CCW: readonly PadSide[] = ["W", "S", "E", "N"];

/** Each side's segment, traversed counter-clockwise, in outline axes of a W × H die. */
function sideSegment(side: PadSide, w: number, h: number): [Position, Position] {
  switch (side) {
    case "W":
      return [
        [0, h],
        [0, 0],
      ];
    case "S":
      return [
        [0, 0],
        [w, 0],
      ];
    case "E":
      return [
        [w, 0],
        [w, h],
      ];
    case "N":
      return [
        [w, h],
        [0, h],
      ];
  }
}

/**
 * The side whose edge is nearest to the pad centre (outline axes). A centre equally near two
 * sides (on a corner's diagonal) goes to the side that leaves that corner counter-clockwise,
 * so a pad on the lower-left corner is on S, lower-right on E, upper-right on N, upper-left on W.
 */
export function nearestSide(centre: Position, w: number, h: number): PadSide {
  const distances = SIDES_CCW.map((side) => distancePointToSegment(centre, ...sideSegment(side, w, h)));
  const best = Math.min(...distances);
  const tolerance = 1e-9 * Math.max(w, h);
  const tied = SIDES_CCW.map((_, i) => distances[i] - best <= tolerance);
  const ties = tied.filter(Boolean).length;
  if (ties === 2) {
    const first = tied.findIndex((t, i) => t && tied[(i + 1) % 4]);
    if (first >= 0) return SIDES_CCW[(first + 1) % 4];
  }
  return SIDES_CCW[tied.indexOf(true)];
}

/** Distance travelled along a side in its counter-clockwise direction, from its start corner. */
export function alongSide(side: PadSide, centre: Position, w: number, h: number): number {
  switch (side) {
    case "W":
      return h - centre[1];
    case "S":
      return centre[0];
    case "E":
      return centre[1];
    case "N":
      return w - centre[0];
  }
}

/**
 * Position on the perimeter counter-clockwise from the top-left corner, in µm: 0 at that corner,
 * 2(W + H) back at it. Centres beyond a corner are clamped onto their own side.
 */
export function perimeterPosition(side: PadSide, centre: Position, w: number, h: number): number {
  const lengths: Record<PadSide, number> = { W: h, S: w, E: h, N: w };
  let offset = 0;
  for (const s of SIDES_CCW) {
    if (s === side) break;
    offset += lengths[s];
  }
  return offset + Math.min(Math.max(alongSide(side, centre, w, h), 0), lengths[side]);
}
