import { describe, expect, it } from "vitest";
import { clampPanelWidth, DEFAULT_PANEL_WIDTH, MIN_PANEL_WIDTH, parseStoredWidth } from "./panel-width";

describe("clampPanelWidth", () => {
  // By hand: a 1600 px window allows 70 % = 1120 px, capped at 1100; a 1000 px window 700 px.
  it("keeps the panel between its floor and 70 % of the window (at most 1100 px)", () => {
    expect(clampPanelWidth(500, 1600)).toBe(500);
    expect(clampPanelWidth(5000, 1600)).toBe(1100);
    expect(clampPanelWidth(900, 1000)).toBe(700);
    expect(clampPanelWidth(100, 1000)).toBe(MIN_PANEL_WIDTH);
    expect(clampPanelWidth(600, 300)).toBe(MIN_PANEL_WIDTH); // a tiny window still gets the floor
    expect(clampPanelWidth(Number.NaN, 1600)).toBe(DEFAULT_PANEL_WIDTH);
  });
  it("reads only whole pixel counts back from storage", () => {
    expect(parseStoredWidth("512")).toBe(512);
    expect(parseStoredWidth(null)).toBeNull();
    expect(parseStoredWidth("wide")).toBeNull();
    expect(parseStoredWidth("-40")).toBeNull();
  });
});
