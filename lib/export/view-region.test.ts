import { describe, expect, it } from "vitest";
import { dieRegionOfImageCorners } from "./view-region";

describe("dieRegionOfImageCorners", () => {
  it("maps a y-down image window to a y-up die rectangle", () => {
    // 0.5 µm/px, image (0, 0) at die (0, 500): px (100, 200)–(300, 400) → x 50–150 µm, y 300–400 µm (worked by hand).
    const r = dieRegionOfImageCorners([[0.5, 0, 0], [0, -0.5, 500]], [{ x: 100, y: 200 }, { x: 300, y: 200 }, { x: 300, y: 400 }, { x: 100, y: 400 }]);
    expect(r).toEqual({ x: 50, y: 300, width: 100, height: 100 });
  });
});
