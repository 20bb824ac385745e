import { describe, expect, it } from "vitest";
import { frameProgress, moveItem, naturalOrder } from "./frame-order";

describe("naturalOrder", () => {
  it("sorts numbered frame names by their numbers (Intl.Collator numeric, ECMA-402)", () => {
    const names = ["IMG_10.jpg", "IMG_2.jpg", "img_1.jpg", "IMG_100.jpg", "IMG_11.jpg"].map((name) => ({ name }));
    expect(naturalOrder(names).map((f) => f.name)).toEqual(["img_1.jpg", "IMG_2.jpg", "IMG_10.jpg", "IMG_11.jpg", "IMG_100.jpg"]);
  });
});

describe("moveItem", () => {
  it("swaps an item with its neighbour and leaves the ends alone", () => {
    expect(moveItem(["a", "b", "c"], 1, -1)).toEqual(["b", "a", "c"]);
    expect(moveItem(["a", "b", "c"], 1, 1)).toEqual(["a", "c", "b"]);
    expect(moveItem(["a", "b", "c"], 0, -1)).toEqual(["a", "b", "c"]);
    expect(moveItem(["a", "b", "c"], 2, 1)).toEqual(["a", "b", "c"]);
  });
});

describe("frameProgress", () => {
  it("fills the frames one after another after the fields' bytes (hand-computed)", () => {
    // Body: 10 bytes of fields, then frames of 100 and 50 bytes.
    expect(frameProgress([100, 50], 0, 160)).toEqual([0, 0]);
    expect(frameProgress([100, 50], 60, 160)).toEqual([0.5, 0]);
    expect(frameProgress([100, 50], 135, 160)).toEqual([1, 0.5]);
    expect(frameProgress([100, 50], 160, 160)).toEqual([1, 1]);
  });
});
