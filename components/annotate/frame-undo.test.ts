import { describe, expect, it } from "vitest";
import { outlineShape, padShape } from "./editor/editor-test-kit";
import { rectangleGeometry } from "./editor/rectangle";
import { frameUndoFor } from "./frame-undo";

const DIE = { widthUm: 2400, heightUm: 1600 };

describe("frameUndoFor", () => {
  it("puts the earlier origin at minus the new outline's lower-left corner, with the replaced outline", () => {
    const earlier = outlineShape("o0");
    const drawn = { ...outlineShape("o1"), geometry: rectangleGeometry({ minX: 3, minY: 4, maxX: 2397, maxY: 1597 }) };
    // Hand-worked: the new origin is (3, 4), so the earlier one lies at (−3, −4) afterwards.
    expect(
      frameUndoFor(
        [
          { before: earlier, after: null },
          { before: null, after: drawn },
        ],
        DIE,
      ),
    ).toEqual({
      originUm: [-3, -4],
      widthUm: 2400,
      heightUm: 1600,
      outline: earlier.geometry,
    });
  });

  it("has no outline to bring back for a first outline, and nothing for entries that do not re-frame", () => {
    const drawn = { ...outlineShape("o1"), geometry: rectangleGeometry({ minX: 10, minY: 20, maxX: 2390, maxY: 1580 }) };
    expect(frameUndoFor([{ before: null, after: drawn }], { widthUm: null, heightUm: null })).toEqual({
      originUm: [-10, -20],
      widthUm: null,
      heightUm: null,
      outline: null,
    });
    expect(frameUndoFor([{ before: null, after: padShape("p", 60, 800) }], DIE)).toBeNull();
    expect(frameUndoFor([{ before: outlineShape("o0"), after: null }], DIE)).toBeNull();
  });
});
