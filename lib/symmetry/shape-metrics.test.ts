import { describe, it, expect } from "vitest";
import { boundingBox, pathLength, shapeCentre } from "./shape-metrics";

describe("shapeCentre", () => {
  it("finds the area centroid of an L-shaped block", () => {
    // Worked by hand: L = 4×1 bar (centroid (2, 0.5), area 4) + 1×3 bar on top at x 0–1
    // (centroid (0.5, 2.5), area 3): centroid = ((8 + 1.5)/7, (2 + 7.5)/7).
    const c = shapeCentre({
      type: "Polygon",
      coordinates: [
        [
          [0, 0],
          [4, 0],
          [4, 1],
          [1, 1],
          [1, 4],
          [0, 4],
          [0, 0],
        ],
      ],
    });
    expect(c[0]).toBeCloseTo(9.5 / 7, 12);
    expect(c[1]).toBeCloseTo(9.5 / 7, 12);
  });

  it("subtracts holes and ignores ring orientation", () => {
    // 10×10 square with a 2×2 hole at x 6–8, y 6–8: (100·5 − 4·7)/96 = 472/96 on each axis.
    const c = shapeCentre({
      type: "Polygon",
      coordinates: [
        [
          [0, 0],
          [0, 10],
          [10, 10],
          [10, 0],
          [0, 0],
        ],
        [
          [6, 6],
          [8, 6],
          [8, 8],
          [6, 8],
          [6, 6],
        ],
      ],
    });
    expect(c[0]).toBeCloseTo(472 / 96, 12);
    expect(c[1]).toBeCloseTo(472 / 96, 12);
  });

  it("weights a line by length and returns a point as is", () => {
    // Segments of length 10 (midpoint (5, 0)) and 2 (midpoint (10, 1)): x = (50 + 20)/12, y = 2/12.
    const c = shapeCentre({
      type: "LineString",
      coordinates: [
        [0, 0],
        [10, 0],
        [10, 2],
      ],
    });
    expect(c[0]).toBeCloseTo(70 / 12, 12);
    expect(c[1]).toBeCloseTo(2 / 12, 12);
    expect(shapeCentre({ type: "Point", coordinates: [3, 4] })).toEqual([3, 4]);
  });
});

describe("boundingBox and pathLength", () => {
  it("measure a trace", () => {
    const g = {
      type: "LineString" as const,
      coordinates: [
        [0, 0],
        [3, 4],
        [3, 10],
      ] as [number, number][],
    };
    expect(pathLength(g)).toBeCloseTo(11, 12);
    expect(boundingBox(g)).toEqual({ minX: 0, minY: 0, maxX: 3, maxY: 10 });
  });
});
