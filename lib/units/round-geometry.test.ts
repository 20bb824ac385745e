import { describe, expect, it } from "vitest";
import { roundGeometryUm } from "./round-geometry";

describe("roundGeometryUm", () => {
  it("drops float noise to the decimals a 0.45 µm/px scale resolves (one decimal)", () => {
    // 0.45 µm per pixel: one unit of the first decimal (0.1 µm) is below a pixel, of the second is not.
    const ring: [number, number][] = [
      [2393.9998965514333, 26.999981],
      [2400.04, 26.999981],
      [2400.04, 40],
      [2393.9998965514333, 26.999981],
    ];
    expect(roundGeometryUm({ type: "Polygon", coordinates: [ring] }, 0.45)).toEqual({
      type: "Polygon",
      coordinates: [
        [
          [2394, 27],
          [2400, 27],
          [2400, 40],
          [2394, 27],
        ],
      ],
    });
    expect(roundGeometryUm({ type: "Point", coordinates: [-0.0000001, 12.345] }, null)).toEqual({ type: "Point", coordinates: [0, 12.35] });
    expect(
      roundGeometryUm(
        {
          type: "LineString",
          coordinates: [
            [1.26, 0],
            [3.74, 0],
          ],
        },
        1.33,
      ),
    ).toEqual({
      type: "LineString",
      coordinates: [
        [1, 0],
        [4, 0],
      ],
    });
  });
});
