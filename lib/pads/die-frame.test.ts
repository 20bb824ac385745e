import { describe, it, expect } from "vitest";
import type { PolygonGeometry, Position } from "../geometry/types";
import { dieFrameFromOutline, toOutlineAxes } from "./die-frame";
import { nearestSide, perimeterPosition } from "./perimeter";

const ring = (...pts: Position[]): PolygonGeometry => ({ type: "Polygon", coordinates: [[...pts, pts[0]]] });

describe("dieFrameFromOutline", () => {
  it("reads the axis-aligned 2400 × 1600 µm die whatever the ring's start and direction", () => {
    for (const outline of [
      ring([0, 0], [2400, 0], [2400, 1600], [0, 1600]),
      ring([2400, 1600], [2400, 0], [0, 0], [0, 1600]), // clockwise, other start
    ]) {
      const frame = dieFrameFromOutline(outline);
      expect(frame).toMatchObject({ origin: [0, 0], widthUm: 2400, heightUm: 1600, rotationDeg: 0 });
    }
  });

  it("finds the lower-left corner and axes of a die turned by 3-4-5 angles", () => {
    // Bottom edge along (4, 3)/5, i.e. atan(3/4) = 36.87° (by hand), 500 µm long; side 250 µm
    // along (−3, 4)/5. Corner at (100, 100).
    const outline = ring([100, 100], [500, 400], [350, 600], [-50, 300]);
    const frame = dieFrameFromOutline(outline);
    expect(frame.origin).toEqual([100, 100]);
    expect(frame.widthUm).toBeCloseTo(500, 12);
    expect(frame.heightUm).toBeCloseTo(250, 12);
    expect(frame.rotationDeg).toBeCloseTo((Math.atan2(3, 4) * 180) / Math.PI, 12);
    const [x, y] = toOutlineAxes(frame, [350, 600]); // the far corner
    expect(x).toBeCloseTo(500, 9);
    expect(y).toBeCloseTo(250, 9);
  });
});

describe("perimeter helpers", () => {
  it("measures positions counter-clockwise from the top-left corner", () => {
    // 2400 × 1600 die: W runs 0–1600, S 1600–4000, E 4000–5600, N 5600–8000 (by hand).
    expect(perimeterPosition("W", [0, 1600], 2400, 1600)).toBe(0);
    expect(perimeterPosition("S", [1200, 0], 2400, 1600)).toBe(2800);
    expect(perimeterPosition("E", [2400, 800], 2400, 1600)).toBe(4800);
    expect(perimeterPosition("N", [0, 1600], 2400, 1600)).toBe(8000);
  });

  it("assigns a centre outside the die to the nearest edge segment", () => {
    // (100, 1700): 100 µm above the top edge, √(100² + 100²) from the left edge's top end,
    // so N by the segment distances (by hand); (−30, 1500) is 30 µm left of the left edge.
    expect(nearestSide([100, 1700], 2400, 1600)).toBe("N");
    expect(nearestSide([-30, 1500], 2400, 1600)).toBe("W");
  });
});
