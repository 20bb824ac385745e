import { describe, expect, it } from "vitest";
import type { AnyShape } from "@/lib/markup/types";
import { labelOf } from "./draw-markup";

const ruler = (label: string): AnyShape =>
  ({
    id: "r",
    kind: "ruler",
    geometry: {
      type: "LineString",
      coordinates: [
        [10, 20],
        [40, 60],
      ],
    },
    properties: { label },
    version: 1,
    createdBy: null,
    updatedAt: "2025-01-01T00:00:00.000Z",
  }) as AnyShape;

describe("labelOf on the canvas", () => {
  it("shows a finished ruler's length in the decimals the micrograph's scale resolves", () => {
    // A 30-40-50 right triangle: (10, 20) → (40, 60) µm is 50 µm. 0.45 µm/px resolves 0.1 µm, 2 µm/px whole µm.
    expect(labelOf(ruler(""), 0.45)).toBe("50.0 µm");
    expect(labelOf(ruler("gate pitch"), 2)).toBe("gate pitch: 50 µm");
    expect(labelOf(ruler(""))).toBe("50.00 µm");
  });
});
