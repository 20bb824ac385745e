import { describe, it, expect } from "vitest";
import type { LineStringGeometry, PolygonGeometry, Position } from "../geometry/types";
import { axisLine, mirrorGeometry, reflectPoint, signedDistance } from "./reflect";
import { SymmetryInputError } from "./types";

const axis = (a: Position, b: Position): LineStringGeometry => ({ type: "LineString", coordinates: [a, b] });

/** Signed area by the shoelace formula (positive = counter-clockwise). */
function signedArea(ring: readonly Position[]): number {
  let s = 0;
  for (let i = 0; i + 1 < ring.length; i++) s += ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1];
  return s / 2;
}

describe("reflectPoint", () => {
  it("matches hand-worked reflections", () => {
    // Worked by hand: across y = x, (x, y) → (y, x).
    const diag = axisLine(axis([0, 0], [5, 5]));
    expect(reflectPoint([3, 1], diag)[0]).toBeCloseTo(1, 12);
    expect(reflectPoint([3, 1], diag)[1]).toBeCloseTo(3, 12);
    // Across y = 2x: reflection matrix [[cos 2θ, sin 2θ], [sin 2θ, −cos 2θ]] with tan θ = 2,
    // cos 2θ = −3/5, sin 2θ = 4/5, so (1, 0) → (−0.6, 0.8).
    const steep = axisLine(axis([0, 0], [1, 2]));
    const [x, y] = reflectPoint([1, 0], steep);
    expect(x).toBeCloseTo(-0.6, 12);
    expect(y).toBeCloseTo(0.8, 12);
    // Across the die's horizontal axis y = 800: (100, 900) → (100, 700).
    const horizontal = axisLine(axis([0, 800], [2400, 800]));
    expect(reflectPoint([100, 900], horizontal)).toEqual([100, 700]);
    // Across x + y = 2 (through (2, 0) and (0, 2)): the origin maps to (2, 2).
    const anti = axisLine(axis([2, 0], [0, 2]));
    expect(reflectPoint([0, 0], anti)[0]).toBeCloseTo(2, 12);
    expect(reflectPoint([0, 0], anti)[1]).toBeCloseTo(2, 12);
  });

  it("is its own inverse and fixes points on the axis", () => {
    const line = axisLine(axis([10, -3], [250, 77]));
    for (const p of [
      [0, 0],
      [123.4, -56.7],
      [1e4, 3e3],
    ] as Position[]) {
      const back = reflectPoint(reflectPoint(p, line), line);
      expect(back[0]).toBeCloseTo(p[0], 9);
      expect(back[1]).toBeCloseTo(p[1], 9);
    }
    const on = reflectPoint([130, 37], line);
    expect(on[0]).toBeCloseTo(130, 9);
    expect(on[1]).toBeCloseTo(37, 9);
  });

  it("measures signed distance positive on the left of the axis direction", () => {
    const line = axisLine(axis([0, 800], [2400, 800]));
    expect(signedDistance([5, 900], line)).toBeCloseTo(100, 12);
    expect(signedDistance([5, 750], line)).toBeCloseTo(-50, 12);
  });

  it("rejects a degenerate axis", () => {
    expect(() => axisLine(axis([1, 1], [1, 1]))).toThrow(SymmetryInputError);
    expect(() =>
      axisLine({
        type: "LineString",
        coordinates: [
          [0, 0],
          [1, 0],
          [2, 0],
        ],
      }),
    ).toThrow(SymmetryInputError);
    expect(() => axisLine(axis([0, Number.NaN], [1, 0]))).toThrow(SymmetryInputError);
  });
});

describe("mirrorGeometry", () => {
  it("mirrors each kind of geometry and keeps polygon winding", () => {
    const a = axis([0, 800], [2400, 800]);
    const pad: PolygonGeometry = {
      type: "Polygon",
      coordinates: [
        [
          [100, 1500],
          [180, 1500],
          [180, 1580],
          [100, 1580],
          [100, 1500],
        ],
      ],
    };
    const ghost = mirrorGeometry(pad, a) as PolygonGeometry;
    expect(signedArea(ghost.coordinates[0])).toBeCloseTo(signedArea(pad.coordinates[0]), 9);
    const ys = ghost.coordinates[0].map((p) => p[1]).sort((p, q) => p - q);
    expect(ys[0]).toBeCloseTo(20, 9);
    expect(ys.at(-1)).toBeCloseTo(100, 9);
    expect(mirrorGeometry({ type: "Point", coordinates: [5, 810] }, a)).toEqual({ type: "Point", coordinates: [5, 790] });
    expect(
      mirrorGeometry(
        {
          type: "LineString",
          coordinates: [
            [0, 900],
            [10, 1000],
          ],
        },
        a,
      ),
    ).toEqual({
      type: "LineString",
      coordinates: [
        [0, 700],
        [10, 600],
      ],
    });
  });
});
