import { describe, expect, it } from "vitest";
import { dieFrameOf, isOutsideDie } from "./outside-die";
import type { AnyShape } from "./types";

const T = "2026-03-02T10:00:00.000Z";
const rect = (x0: number, y0: number, x1: number, y1: number) => ({
  type: "Polygon" as const,
  coordinates: [
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
      [x0, y0],
    ] as [number, number][],
  ],
});
const shape = (kind: AnyShape["kind"], geometry: AnyShape["geometry"]): AnyShape =>
  ({ id: kind, kind, geometry, properties: {}, version: 1, createdBy: null, updatedAt: T }) as AnyShape;

describe("isOutsideDie", () => {
  // The invented NV-24R die, 2400 × 1600 µm, its outline drawn at (100, 50).
  const outline = shape("die_outline", rect(100, 50, 2500, 1650));

  it("flags a pad whose centre is off the drawn outline, not one on its edge", () => {
    const frame = dieFrameOf([outline], null);
    // Centre (80, 800) is 20 µm left of the outline's left edge x = 100 (hand-worked).
    expect(isOutsideDie(shape("pad", rect(40, 760, 120, 840)), frame)).toBe(true);
    // Centre (100, 800) lies exactly on the edge: on the die.
    expect(isOutsideDie(shape("pad", rect(60, 760, 140, 840)), frame)).toBe(false);
  });

  it("never flags wire bonds, notes or rulers, which leave the die by nature", () => {
    const frame = dieFrameOf([], { widthUm: 2400, heightUm: 1600 });
    expect(
      isOutsideDie(
        shape("wire_bond", {
          type: "LineString",
          coordinates: [
            [-400, 0],
            [-300, 0],
          ],
        }),
        frame,
      ),
    ).toBe(false);
    expect(isOutsideDie(shape("note", { type: "Point", coordinates: [-300, 0] }), frame)).toBe(false);
    expect(isOutsideDie(shape("block", rect(2500, 0, 2600, 100)), frame)).toBe(true);
  });

  it("says nothing without an outline or a recorded size", () => {
    expect(dieFrameOf([], { widthUm: null, heightUm: null })).toBeNull();
    expect(isOutsideDie(shape("pad", rect(-900, 0, -800, 100)), null)).toBe(false);
  });
});
