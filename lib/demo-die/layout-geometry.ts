// Small geometry builders the demo die's layout is written with.
import type { Position } from "../geometry/types";

/** A closed axis-aligned rectangle ring, counter-clockwise from the lower-left corner. */
export function rect(x0: number, y0: number, x1: number, y1: number): Position[] {
  return [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
    [x0, y0],
  ];
}

/** A square-wave centre line from (x0, y) to (x1, y) swinging between yLow and yHigh. */
export function meanderLine(x0: number, x1: number, y: number, yLow: number, yHigh: number, pitch: number): Position[] {
  const points: Position[] = [
    [x0 - 40, y],
    [x0, y],
  ];
  let high = true;
  for (let x = x0; x < x1; x += pitch) {
    const level = high ? yHigh : yLow;
    points.push([x, level], [x + pitch, level]);
    high = !high;
  }
  points.push([x1, y], [x1 + 30, y]);
  return points;
}
