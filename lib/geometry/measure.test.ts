import { describe, it, expect } from "vitest";
import type { PolygonGeometry, Position } from "./types";
import {
  boundingBox,
  closeRing,
  distancePointToSegment,
  distinctVertexCount,
  geometryCentre,
  isRingClosed,
  normaliseRing,
  openRing,
  polygonArea,
  polygonCentroid,
  polylineLength,
  ringArea,
  signedRingArea,
} from "./measure";

const polygon = (...rings: Position[][]): PolygonGeometry => ({ type: "Polygon", coordinates: rings });

// Right triangle with legs 3 and 4 (the 3-4-5 triangle, Euclid I.47): hypotenuse 5,
// perimeter 12, area ½·3·4 = 6, centroid at the mean of the vertices (1, 4/3).
const triangle: Position[] = [
  [0, 0],
  [3, 0],
  [0, 4],
  [0, 0],
];
const unitSquare: Position[] = [
  [0, 0],
  [1, 0],
  [1, 1],
  [0, 1],
  [0, 0],
];
// L-shape worked by hand by splitting it into two rectangles (composite-area method):
//   A = [0,2]×[0,1]: area 2, centre (1, 0.5);  B = [0,1]×[1,2]: area 1, centre (0.5, 1.5).
//   Area 3; centroid x = (2·1 + 1·0.5)/3 = 5/6, y = (2·0.5 + 1·1.5)/3 = 5/6.
const lShape: Position[] = [
  [0, 0],
  [2, 0],
  [2, 1],
  [1, 1],
  [1, 2],
  [0, 2],
  [0, 0],
];

describe("polylineLength", () => {
  it("sums the sides of the 3-4-5 triangle to 12", () => {
    expect(polylineLength(triangle)).toBeCloseTo(12, 12); // 3 + 4 + 5, by hand
  });

  it("gives 0 for a single position", () => {
    expect(polylineLength([[5, 5]])).toBe(0);
  });
});

describe("shoelace area", () => {
  it("gives +6 for the counter-clockwise 3-4-5 triangle and −6 reversed", () => {
    expect(signedRingArea(triangle)).toBe(6); // ½·base·height, by hand
    expect(signedRingArea([...triangle].reverse())).toBe(-6);
    expect(ringArea([...triangle].reverse())).toBe(6);
  });

  it("gives 1 for the unit square, open or closed", () => {
    expect(signedRingArea(unitSquare)).toBe(1);
    expect(signedRingArea(openRing(unitSquare))).toBe(1);
  });

  it("gives 3 for the L-shape worked by hand", () => {
    expect(signedRingArea(lShape)).toBe(3); // 2 + 1 from the two rectangles above
  });

  it("keeps precision far from the origin", () => {
    // A 0.1 µm × 0.1 µm square at (2400 µm, 1600 µm): area 0.01 µm² by hand.
    const far: Position[] = [
      [2400, 1600],
      [2400.1, 1600],
      [2400.1, 1600.1],
      [2400, 1600.1],
      [2400, 1600],
    ];
    expect(ringArea(far)).toBeCloseTo(0.01, 9);
  });

  it("subtracts holes whatever their orientation", () => {
    // 10×10 square less a 2×2 hole: 100 − 4 = 96, by hand.
    const outer: Position[] = [
      [0, 0],
      [10, 0],
      [10, 10],
      [0, 10],
      [0, 0],
    ];
    const hole: Position[] = [
      [1, 1],
      [3, 1],
      [3, 3],
      [1, 3],
      [1, 1],
    ];
    expect(polygonArea(polygon(outer, hole))).toBe(96);
    expect(polygonArea(polygon(outer, [...hole].reverse()))).toBe(96);
  });
});

describe("polygonCentroid", () => {
  it("puts the 3-4-5 triangle's centroid at the mean of its vertices", () => {
    const [x, y] = polygonCentroid(polygon(triangle)); // triangle centroid = vertex mean (textbook)
    expect(x).toBeCloseTo(1, 12);
    expect(y).toBeCloseTo(4 / 3, 12);
  });

  it("puts the unit square's centroid at (0.5, 0.5)", () => {
    expect(polygonCentroid(polygon(unitSquare))).toEqual([0.5, 0.5]);
  });

  it("finds the L-shape's centroid at (5/6, 5/6)", () => {
    const [x, y] = polygonCentroid(polygon(lShape)); // composite-area method, worked above
    expect(x).toBeCloseTo(5 / 6, 12);
    expect(y).toBeCloseTo(5 / 6, 12);
  });

  it("accounts for an off-centre hole", () => {
    // Composite area by hand: (100·5 − 4·2)/96 = 492/96 = 5.125 on both axes.
    const outer: Position[] = [
      [0, 0],
      [10, 0],
      [10, 10],
      [0, 10],
      [0, 0],
    ];
    const hole: Position[] = [
      [1, 1],
      [3, 1],
      [3, 3],
      [1, 3],
      [1, 1],
    ];
    const [x, y] = polygonCentroid(polygon(outer, hole));
    expect(x).toBeCloseTo(5.125, 12);
    expect(y).toBeCloseTo(5.125, 12);
  });

  it("falls back to the vertex mean for a polygon without area", () => {
    expect(
      polygonCentroid(
        polygon([
          [0, 0],
          [2, 0],
          [4, 0],
          [0, 0],
        ]),
      ),
    ).toEqual([2, 0]);
  });
});

describe("boundingBox and geometryCentre", () => {
  it("bounds the L-shape by [0,2]×[0,2]", () => {
    expect(boundingBox(polygon(lShape))).toEqual({ minX: 0, minY: 0, maxX: 2, maxY: 2 });
  });

  it("returns a point's own position as its centre", () => {
    expect(geometryCentre({ type: "Point", coordinates: [7, -3] })).toEqual([7, -3]);
  });

  it("weights a line's centre by segment length", () => {
    // Segments (0,0)-(4,0) length 4, centre (2,0); (4,0)-(4,2) length 2, centre (4,1).
    // By hand: x = (4·2 + 2·4)/6 = 16/6, y = (4·0 + 2·1)/6 = 1/3.
    const [x, y] = geometryCentre({
      type: "LineString",
      coordinates: [
        [0, 0],
        [4, 0],
        [4, 2],
      ],
    });
    expect(x).toBeCloseTo(16 / 6, 12);
    expect(y).toBeCloseTo(1 / 3, 12);
  });

  it("uses the centre of area for a polygon", () => {
    const [x, y] = geometryCentre(polygon(lShape));
    expect(x).toBeCloseTo(5 / 6, 12);
    expect(y).toBeCloseTo(5 / 6, 12);
  });
});

describe("distancePointToSegment", () => {
  it("measures the perpendicular distance inside the segment", () => {
    expect(distancePointToSegment([3, 4], [0, 0], [10, 0])).toBe(4);
  });

  it("measures to the nearer end beyond the segment (3-4-5)", () => {
    expect(distancePointToSegment([13, 4], [0, 0], [10, 0])).toBe(5); // √(3² + 4²)
    expect(distancePointToSegment([-3, -4], [0, 0], [10, 0])).toBe(5);
  });

  it("handles a slanted segment", () => {
    // Segment on the line y = x; the point (0, 2) lies √2 from it (distance |x − y|/√2), by hand.
    expect(distancePointToSegment([0, 2], [-5, -5], [5, 5])).toBeCloseTo(Math.SQRT2, 12);
  });

  it("treats a zero-length segment as a point", () => {
    expect(distancePointToSegment([3, 4], [0, 0], [0, 0])).toBe(5);
  });
});

describe("ring helpers", () => {
  it("closes an open ring and leaves a closed one alone", () => {
    const open: Position[] = [
      [0, 0],
      [1, 0],
      [1, 1],
    ];
    expect(closeRing(open)).toEqual([
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 0],
    ]);
    expect(closeRing(closeRing(open))).toEqual([
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 0],
    ]);
    expect(isRingClosed(open)).toBe(false);
  });

  it("opens a closed ring", () => {
    expect(openRing(unitSquare)).toEqual([
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 1],
    ]);
  });

  it("drops repeated positions and orients the ring counter-clockwise", () => {
    const messy: Position[] = [
      [0, 0],
      [0, 1],
      [0, 1],
      [1, 1],
      [1, 0],
      [0, 0],
      [0, 0],
    ];
    const ring = normaliseRing(messy);
    expect(ring).toEqual([
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 1],
      [0, 0],
    ]);
    expect(signedRingArea(ring)).toBe(1);
    expect(signedRingArea(normaliseRing(messy, "cw"))).toBe(-1);
  });

  it("counts distinct vertices, not the closing repeat", () => {
    expect(distinctVertexCount(unitSquare)).toBe(4);
    expect(
      distinctVertexCount([
        [0, 0],
        [1, 0],
        [0, 0],
        [1, 0],
      ]),
    ).toBe(2);
    expect(distinctVertexCount(lShape)).toBe(6);
  });
});
