import { describe, it, expect } from "vitest";
import { frameFromScale } from "@/lib/geometry/affine";
import { cursorReading } from "./cursor-format";

describe("cursorReading", () => {
  it("reads die µm with y up through the micrograph's transform", () => {
    // Worked by hand: 0.25 µm/px (5 µm pixels at 20x, REFERENCES.md), image 1000 px high, so
    // image (100, 0) is 25 µm right and 250 µm up from the lower-left corner.
    const r = cursorReading({ x: 100, y: 0 }, frameFromScale(0.25, 1000));
    expect(r?.unit).toBe("µm");
    expect(r?.x).toBeCloseTo(25, 9);
    expect(r?.y).toBeCloseTo(250, 9);
    expect(r?.text).toBe("x 25.0 µm · y 250.0 µm");
  });

  it("falls back to image px without a transform", () => {
    expect(cursorReading({ x: 1234.54, y: 806.2 }, null)?.text).toBe("x 1234.5 px · y 806.2 px");
  });

  it("reads nothing for a missing or non-finite position", () => {
    expect(cursorReading(null, null)).toBeNull();
    expect(cursorReading({ x: Number.NaN, y: 1 }, null)).toBeNull();
  });
});
