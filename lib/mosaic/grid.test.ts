import { describe, expect, it } from "vitest";
import { captureGrid } from "./grid";

// Reference: the capture paths as the issue defines them ("rows": each row left to right, rows
// top to bottom; "serpentine": rows alternate direction), written out by hand.
describe("captureGrid", () => {
  it("lists a rows capture left to right, top to bottom", () => {
    expect(captureGrid(2, 3, "rows").map((c) => [c.index, c.row, c.col])).toEqual([
      [0, 0, 0],
      [1, 0, 1],
      [2, 0, 2],
      [3, 1, 0],
      [4, 1, 1],
      [5, 1, 2],
    ]);
  });

  it("runs the odd rows of a serpentine capture right to left", () => {
    expect(captureGrid(3, 2, "serpentine").map((c) => [c.row, c.col])).toEqual([
      [0, 0],
      [0, 1],
      [1, 1],
      [1, 0],
      [2, 0],
      [2, 1],
    ]);
  });

  it("refuses a grid without cells", () => {
    expect(() => captureGrid(0, 3, "rows")).toThrow(RangeError);
    expect(() => captureGrid(2, 1.5, "rows")).toThrow(RangeError);
  });
});
