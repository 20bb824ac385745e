import { describe, it, expect } from "vitest";
import { Matrix } from "ml-matrix";
import type { Affine2x3, PolygonGeometry } from "./types";
import { transformGeometry, translateGeometry } from "./transform-geometry";

// 0.25 µm/px with the y flip: the frame of a 5 µm-pixel camera at 20x (REFERENCES.md, Scale
// and optics: 5 µm / 20 = 0.25 µm/px), image 4000 px high, so pixel (0, 4000) is die (0, 0).
const frame: Affine2x3 = [
  [0.25, 0, 0],
  [0, -0.25, 1000],
];

/** The same mapping done by ml-matrix in homogeneous coordinates, as an independent check. */
function viaMlMatrix(m: Affine2x3, x: number, y: number): number[] {
  const h = new Matrix([[...m[0]], [...m[1]], [0, 0, 1]]);
  return h
    .mmul(Matrix.columnVector([x, y, 1]))
    .to1DArray()
    .slice(0, 2);
}

describe("transformGeometry", () => {
  it("maps a point as ml-matrix's homogeneous product does", () => {
    const out = transformGeometry(frame, { type: "Point", coordinates: [400, 3600] });
    expect(out.type).toBe("Point");
    const expected = viaMlMatrix(frame, 400, 3600); // ml-matrix Matrix.mmul
    expect(out.coordinates[0]).toBeCloseTo(expected[0], 12);
    expect(out.coordinates[1]).toBeCloseTo(expected[1], 12);
    expect(out.coordinates).toEqual([100, 100]); // by hand: 400·0.25, 1000 − 3600·0.25
  });

  it("maps every position of a polygon with a hole", () => {
    const m: Affine2x3 = [
      [0.9, -0.2, 12],
      [0.3, 1.1, -7],
    ];
    const poly: PolygonGeometry = {
      type: "Polygon",
      coordinates: [
        [
          [0, 0],
          [10, 0],
          [10, 10],
          [0, 10],
          [0, 0],
        ],
        [
          [2, 2],
          [4, 2],
          [4, 4],
          [2, 2],
        ],
      ],
    };
    const out = transformGeometry(m, poly);
    out.coordinates.forEach((ring, r) =>
      ring.forEach((p, i) => {
        const [x, y] = poly.coordinates[r][i];
        const expected = viaMlMatrix(m, x, y); // ml-matrix Matrix.mmul
        expect(p[0]).toBeCloseTo(expected[0], 12);
        expect(p[1]).toBeCloseTo(expected[1], 12);
      }),
    );
  });

  it("keeps a line's position count and leaves the input untouched", () => {
    const line = {
      type: "LineString" as const,
      coordinates: [
        [0, 0],
        [4, 0],
        [4, 8],
      ] as [number, number][],
    };
    const out = transformGeometry(frame, line);
    expect(out.coordinates).toHaveLength(3);
    expect(line.coordinates[2]).toEqual([4, 8]);
    expect(out.coordinates[2]).toEqual([1, 998]); // by hand: 4·0.25, 1000 − 8·0.25
  });
});

describe("translateGeometry", () => {
  it("moves every position by (dx, dy)", () => {
    const out = translateGeometry(
      {
        type: "LineString",
        coordinates: [
          [1, 2],
          [3, 4],
        ],
      },
      10,
      -5,
    );
    expect(out.coordinates).toEqual([
      [11, -3],
      [13, -1],
    ]);
  });
});
