import { describe, expect, it } from "vitest";
import { dieRegionOfImageCorners, wholeDieRegion } from "./view-region";

describe("dieRegionOfImageCorners", () => {
  it("maps a y-down image window to a y-up die rectangle", () => {
    // 0.5 µm/px, image (0, 0) at die (0, 500): px (100, 200)–(300, 400) → x 50–150 µm, y 300–400 µm (worked by hand).
    const r = dieRegionOfImageCorners([[0.5, 0, 0], [0, -0.5, 500]], [{ x: 100, y: 200 }, { x: 300, y: 200 }, { x: 300, y: 400 }, { x: 100, y: 400 }]);
    expect(r).toEqual({ x: 50, y: 300, width: 100, height: 100 });
  });
});

describe("wholeDieRegion", () => {
  // Worked by hand: a 2400 × 1600 µm die whose bond wires end 220 µm beyond its left, right and
  // bottom edges. Union x −220…2620 (2840 µm), y −220…1600 (1820 µm); margin 3 % of 2840 = 85.2 µm.
  it("takes in the bond wires beyond the die edge and adds a margin", () => {
    const r = wholeDieRegion({ widthUm: 2400, heightUm: 1600, extentUm: { minX: -220, minY: -220, maxX: 2620, maxY: 1500 } })!;
    expect(r.x).toBeCloseTo(-305.2, 9);
    expect(r.y).toBeCloseTo(-305.2, 9);
    expect(r.width).toBeCloseTo(3010.4, 9);
    expect(r.height).toBeCloseTo(1990.4, 9);
  });
  it("without markup keeps the die with a margin of 3 % of its larger side (72 µm for 2400 µm)", () => {
    expect(wholeDieRegion({ widthUm: 2400, heightUm: 1600, extentUm: null })).toEqual({ x: -72, y: -72, width: 2544, height: 1744 });
  });
  it("is null for a die without a size", () => {
    expect(wholeDieRegion({ widthUm: null, heightUm: 1600 })).toBeNull();
  });
});
