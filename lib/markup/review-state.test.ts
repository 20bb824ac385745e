import { describe, expect, it } from "vitest";
import { reviewStates } from "./review-state";

describe("shape review state", () => {
  it("is open when any thread on the shape is open, resolved when all are, and absent otherwise", () => {
    const m = reviewStates([
      { shapeId: "a", status: "resolved" },
      { shapeId: "a", status: "open" },
      { shapeId: "b", status: "resolved" },
      { shapeId: null, status: "open" },
    ]);
    expect(m.get("a")).toBe("open");
    expect(m.get("b")).toBe("resolved");
    expect(m.has("c")).toBe(false);
    expect(m.size).toBe(2);
  });
});
