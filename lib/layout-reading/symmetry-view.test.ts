import { describe, it, expect } from "vitest";
import { axisOfShape, colourScaleUm, deviationColour, deviationHue } from "./symmetry-view";
import { shapeOf } from "./test-shapes";

describe("axisOfShape", () => {
  it("joins the first and last vertex of a marked axis", () => {
    const axis = shapeOf("symmetry_axis", {
      type: "LineString",
      coordinates: [
        [0, 800],
        [1200, 800.5],
        [2400, 800],
      ],
    });
    expect(axisOfShape(axis)).toEqual({
      type: "LineString",
      coordinates: [
        [0, 800],
        [2400, 800],
      ],
    });
  });

  it("refuses other kinds and a closed axis", () => {
    expect(
      axisOfShape(
        shapeOf("ruler", {
          type: "LineString",
          coordinates: [
            [0, 0],
            [1, 1],
          ],
        }),
      ),
    ).toBeNull();
    expect(
      axisOfShape(
        shapeOf("symmetry_axis", {
          type: "LineString",
          coordinates: [
            [0, 0],
            [5, 5],
            [0, 0],
          ],
        }),
      ),
    ).toBeNull();
  });
});

describe("deviation colour scale", () => {
  it("runs from green at zero to red at full scale, clamped", () => {
    expect(deviationHue(0, 4)).toBe(150);
    expect(deviationHue(2, 4)).toBe(75);
    expect(deviationHue(4, 4)).toBe(0);
    expect(deviationHue(40, 4)).toBe(0);
    expect(deviationColour(0, 4)).toBe("hsl(150 85% 55%)");
    expect(colourScaleUm(1)).toBe(4);
  });
});
