import { describe, expect, it } from "vitest";
import { padCentre } from "./attachments";
import { handleAt, handlesFor } from "./handles";
import { distanceToPath, hitDistance, hitsAt, pointInRing, shapesInBox } from "./hit-test";
import { blockShape, outlineShape, padShape, traceShape } from "./editor-test-kit";
import { axisAlignedBox, boxFromCorners, rectangleGeometry } from "./rectangle";
import { nextFreeName } from "./shape-factory";
import { insertVertexNear, removeVertex } from "./vertices";

// Every expected value below is hand-worked from the coordinates in the test.

describe("hit testing geometry", () => {
  const square = [
    [0, 0],
    [10, 0],
    [10, 10],
    [0, 10],
    [0, 0],
  ] as const;

  it("tells inside from outside a ring", () => {
    expect(pointInRing([5, 5], square)).toBe(true);
    expect(pointInRing([15, 5], square)).toBe(false);
    // L-shaped ring: the notch (7, 7) is outside.
    const ell = [
      [0, 0],
      [10, 0],
      [10, 5],
      [5, 5],
      [5, 10],
      [0, 10],
      [0, 0],
    ] as const;
    expect(pointInRing([7, 7], ell)).toBe(false);
    expect(pointInRing([2, 8], ell)).toBe(true);
  });

  it("measures the distance to a path, closed or open", () => {
    // (13, 14) to the corner (10, 10): a 3-4-5 triangle.
    expect(distanceToPath([13, 14], square, true)).toBe(5);
    // (5, 8) is 5 from the left edge and 8 from the bottom one; the open path has no top edge (2 away).
    expect(
      distanceToPath(
        [5, 8],
        [
          [0, 10],
          [0, 0],
          [10, 0],
        ],
        false,
      ),
    ).toBe(5);
  });

  it("hits polygons inside and near their edges, the die outline only near its edge", () => {
    const pad = padShape("p", 100, 100);
    expect(hitDistance(pad, [100, 100], 2)).toBe(0);
    expect(hitDistance(pad, [141.5, 100], 2)).toBe(1.5);
    expect(hitDistance(pad, [143, 100], 2)).toBeNull();
    const outline = outlineShape("o");
    expect(hitDistance(outline, [1200, 800], 2)).toBeNull();
    expect(hitDistance(outline, [1200, 1601], 2)).toBe(1);
  });

  it("ranks a smaller shape first, then the nearer", () => {
    const block = blockShape("b", [
      [0, 0],
      [500, 0],
      [500, 500],
      [0, 500],
    ]);
    const pad = padShape("p", 100, 100);
    const trace = traceShape("t", [
      [0, 100],
      [300, 100],
    ]);
    expect(hitsAt([block, pad, trace], [100, 100], 2).map((h) => h.shape.id)).toEqual(["t", "p", "b"]);
  });

  it("box-selects shapes whose bounding box is inside", () => {
    const pad = padShape("p", 100, 100);
    expect(shapesInBox([pad], { minX: 60, minY: 60, maxX: 140, maxY: 140 })).toEqual(["p"]);
    expect(shapesInBox([pad], { minX: 61, minY: 60, maxX: 140, maxY: 140 })).toEqual([]);
  });
});

describe("rectangles and handles", () => {
  it("builds a counter-clockwise rectangle from two corners in any order", () => {
    expect(rectangleGeometry(boxFromCorners([30, 40], [10, 20])).coordinates[0]).toEqual([
      [10, 20],
      [30, 20],
      [30, 40],
      [10, 40],
      [10, 20],
    ]);
  });

  it("recognises only axis-aligned rectangles", () => {
    expect(axisAlignedBox(rectangleGeometry({ minX: 0, minY: 0, maxX: 4, maxY: 2 }))).toEqual({ minX: 0, minY: 0, maxX: 4, maxY: 2 });
    expect(
      axisAlignedBox({
        type: "Polygon",
        coordinates: [
          [
            [0, 0],
            [4, 1],
            [4, 3],
            [0, 2],
            [0, 0],
          ],
        ],
      }),
    ).toBeNull();
  });

  it("gives pads corner handles and blocks and lines vertex handles", () => {
    const pad = padShape("p", 100, 100);
    expect(handlesFor(pad).map((h) => [h.type, h.position])).toEqual([
      ["corner", [60, 60]],
      ["corner", [140, 60]],
      ["corner", [140, 140]],
      ["corner", [60, 140]],
    ]);
    const trace = traceShape("t", [
      [0, 0],
      [10, 0],
    ]);
    expect(handlesFor(trace).map((h) => h.type)).toEqual(["vertex", "vertex"]);
    expect(handleAt(trace, [9, 1], 2)?.index).toBe(1);
    expect(handleAt(trace, [5, 0], 2)).toBeNull();
  });

  it("finds a rectangular pad's centre exactly", () => {
    expect(padCentre(rectangleGeometry({ minX: 0.1, minY: 0.2, maxX: 0.3, maxY: 0.6 }))).toEqual([(0.1 + 0.3) / 2, (0.2 + 0.6) / 2]);
  });
});

describe("vertex edits", () => {
  it("inserts the projection of the point onto the nearest edge", () => {
    // (4, 3) projects onto the segment (0,0)→(10,0) at (4, 0), 3 away.
    const line = {
      type: "LineString",
      coordinates: [
        [0, 0],
        [10, 0],
        [10, 10],
      ],
    } as const;
    expect(insertVertexNear(line, [4, 3], 3)).toEqual({
      geometry: {
        type: "LineString",
        coordinates: [
          [0, 0],
          [4, 0],
          [10, 0],
          [10, 10],
        ],
      },
      index: 1,
    });
    expect(insertVertexNear(line, [4, 3], 2.9)).toBeNull();
  });

  it("inserts on a polygon's closing edge and keeps the ring closed", () => {
    const tri = {
      type: "Polygon",
      coordinates: [
        [
          [0, 0],
          [10, 0],
          [0, 10],
          [0, 0],
        ],
      ],
    } as const;
    expect(insertVertexNear(tri, [-1, 5], 2)?.geometry.coordinates[0]).toEqual([
      [0, 0],
      [10, 0],
      [0, 10],
      [0, 5],
      [0, 0],
    ]);
  });

  it("refuses to go below the minimum vertex count", () => {
    const tri = {
      type: "Polygon",
      coordinates: [
        [
          [0, 0],
          [10, 0],
          [0, 10],
          [0, 0],
        ],
      ],
    } as const;
    expect(removeVertex(tri, 1, 3)).toBeNull();
  });
});

describe("names", () => {
  it("takes the smallest free number", () => {
    expect(nextFreeName("P", [])).toBe("P1");
    expect(nextFreeName("P", ["P1", "P2", "P4"])).toBe("P3");
    expect(nextFreeName("Block ", ["Block 1", "LNA"])).toBe("Block 2");
  });
});
