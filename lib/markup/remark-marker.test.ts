import { describe, expect, it } from "vitest";
import fontkit from "@pdf-lib/fontkit";
import { appFontBytes, textWidthPx } from "@/lib/fonts/app-fonts";
import { REMARK_MARKER_PROPORTIONS, REMARK_MARKER_STYLES, remarkMarkerPath, remarkMarkerShape, remarkMarkerState } from "./remark-marker";

// A consistency test of the one marker design the screen drawer and the SVG export share.
describe("remark marker", () => {
  it("puts the tail's tip exactly on the anchor, with the tag above and right of it", () => {
    for (const size of [16, 20.8, 40.5]) {
      const s = remarkMarkerShape(size, 7);
      expect(s.outline[0]).toEqual([0, 0]);
      for (const [x, y] of s.outline.slice(1)) {
        expect(x).toBeGreaterThan(0);
        expect(y).toBeLessThan(0);
      }
      expect(s.box).toEqual({
        minX: 0,
        maxY: 0,
        minY: Math.min(...s.outline.map((p) => p[1])),
        maxX: Math.max(...s.outline.map((p) => p[0])),
      });
      // The path starts at the tip wherever the drawer puts it.
      expect(remarkMarkerPath(s, 300, 700).startsWith("M300,700L")).toBe(true);
    }
  });

  it("scales as one shape: every point of a twice-as-large marker is twice as far from the tip", () => {
    const a = remarkMarkerShape(16, 12);
    const b = remarkMarkerShape(32, 12);
    b.outline.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(a.outline[i][0] * 2, 9);
      expect(y).toBeCloseTo(a.outline[i][1] * 2, 9);
    });
    expect(b.label.fontPx).toBeCloseTo(a.label.fontPx * 2, 9);
  });

  it("holds its number inside the body, three digits too (widths from the shipped DejaVu Sans Bold)", () => {
    for (const n of [1, 42, 128]) {
      const s = remarkMarkerShape(20, n);
      const bodyLeft = s.outline[4][0];
      const bodyRight = s.outline[2][0];
      const width = textWidthPx(String(n), s.label.fontPx, "bold");
      expect(s.label.x - width / 2).toBeGreaterThan(bodyLeft + s.edgePx);
      expect(s.label.x + width / 2).toBeLessThan(bodyRight - s.edgePx);
    }
  });

  it("has the digits' middle 0.36 em above the baseline, where the export centres them (glyph boxes read with fontkit)", () => {
    type Face = { unitsPerEm: number; glyphForCodePoint(c: number): { bbox: { minY: number; maxY: number } } };
    const face = fontkit.create(appFontBytes("bold")) as unknown as Face;
    for (let c = 48; c <= 57; c++) {
      const { minY, maxY } = face.glyphForCodePoint(c).bbox;
      expect((minY + maxY) / 2 / face.unitsPerEm).toBeCloseTo(REMARK_MARKER_PROPORTIONS.numberBaselineEm, 1);
    }
  });

  it("shows open and closed remarks differently, reading the stored `resolved` as closed", () => {
    expect(remarkMarkerState("open")).toBe("open");
    expect(remarkMarkerState("resolved")).toBe("closed");
    const { open, closed } = REMARK_MARKER_STYLES;
    expect(open.plate).not.toBe(closed.plate);
    expect(open.edge).not.toBe(closed.edge);
    expect(open.number).not.toBe(closed.number);
  });
});
