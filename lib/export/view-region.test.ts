import { describe, expect, it } from "vitest";
import { wholeDieRegion } from "./view-region";

describe("wholeDieRegion", () => {
  // Worked by hand. A 2400 × 1600 µm die keeps 10 % of 2400 = 240 µm around it:
  // x −240…2640, y −240…1840. Bond wires drawn to 220 µm beyond its left, right and bottom
  // edges: die and markup span x −220…2620 (2840 µm), y −220…1600; margin 3 % of 2840 = 85.2 µm,
  // so x −305.2…2705.2 and y −305.2…1685.2. The union: x −305.2…2705.2, y −305.2…1840.
  it("takes in the bond wires drawn beyond the die edge, with a margin", () => {
    const r = wholeDieRegion({ widthUm: 2400, heightUm: 1600, extentUm: { minX: -220, minY: -220, maxX: 2620, maxY: 1500 } })!;
    expect(r.x).toBeCloseTo(-305.2, 9);
    expect(r.y).toBeCloseTo(-305.2, 9);
    expect(r.width).toBeCloseTo(3010.4, 9);
    expect(r.height).toBeCloseTo(2145.2, 9);
  });
  it("without markup keeps 10 % of the die's larger side around it (240 µm for 2400 µm)", () => {
    expect(wholeDieRegion({ widthUm: 2400, heightUm: 1600, extentUm: null })).toEqual({ x: -240, y: -240, width: 2880, height: 2080 });
  });
  it("is null for a die without a size", () => {
    expect(wholeDieRegion({ widthUm: null, heightUm: 1600 })).toBeNull();
  });
});
