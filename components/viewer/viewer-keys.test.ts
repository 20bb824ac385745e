import { describe, it, expect } from "vitest";
import { viewerActionForKey, ZOOM_STEP } from "./viewer-keys";

describe("viewerActionForKey", () => {
  it("maps plus, equals, minus, zero and the arrows", () => {
    expect(viewerActionForKey("+")).toEqual({ kind: "zoom", factor: ZOOM_STEP });
    expect(viewerActionForKey("=")).toEqual({ kind: "zoom", factor: ZOOM_STEP });
    expect(viewerActionForKey("-")).toEqual({ kind: "zoom", factor: 1 / ZOOM_STEP });
    expect(viewerActionForKey("0")).toEqual({ kind: "home" });
    expect(viewerActionForKey("ArrowLeft")).toMatchObject({ kind: "pan", dy: 0 });
    expect(viewerActionForKey("ArrowDown")).toMatchObject({ kind: "pan", dx: 0 });
  });

  it("ignores other keys, including inherited object names", () => {
    expect(viewerActionForKey("r")).toBeNull();
    expect(viewerActionForKey("toString")).toBeNull();
  });
});
