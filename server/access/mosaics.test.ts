import { describe, expect, it } from "vitest";
import { keepFrameZero } from "./mosaics";

describe("keepFrameZero", () => {
  it("shifts the transform so frame 0's corner maps to the same die point (hand-worked)", () => {
    // 0.2 µm/px, y flipped; frame 0 was at (10, 20) px and is now at (4, 8) px.
    const t = keepFrameZero(
      [
        [0.2, 0, 0],
        [0, -0.2, 100],
      ],
      { index: 0, row: 0, col: 0, x: 10, y: 20 },
      { index: 0, row: 0, col: 0, x: 4, y: 8 },
    )!;
    // Before: (10, 20) → (2, 96). After: (4, 8) must map there too.
    expect(t[0][0] * 4 + t[0][1] * 8 + t[0][2]).toBeCloseTo(2, 12);
    expect(t[1][0] * 4 + t[1][1] * 8 + t[1][2]).toBeCloseTo(96, 12);
  });

  it("leaves a micrograph outside the die frame as it is", () => {
    expect(keepFrameZero(null, undefined, undefined)).toBeNull();
  });
});
