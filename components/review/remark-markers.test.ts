import { describe, expect, it } from "vitest";
import { remarkMarkersDrawer } from "./remark-markers";
import { REMARK_MARKER_SIZES, REMARK_MARKER_STYLES, remarkMarkerPath, remarkMarkerShape } from "@/lib/markup/remark-marker";
import { markupLayerSvg } from "@/lib/export/markup-svg";
import type { Affine2x3 } from "@/lib/geometry/types";

/** A canvas context that writes down the path it is given, as an SVG path. */
function recordingContext() {
  const fills: string[] = [];
  let d = "";
  const f = (v: number) => String(Math.round(v * 100) / 100);
  const ctx = {
    save() {},
    restore() {},
    beginPath: () => (d = ""),
    moveTo: (x: number, y: number) => (d += `M${f(x)},${f(y)}`),
    lineTo: (x: number, y: number) => (d += `L${f(x)},${f(y)}`),
    closePath: () => (d += "Z"),
    fill() {
      fills.push(`${d}|${this.fillStyle}`);
    },
    stroke() {},
    fillText() {},
    fillStyle: "",
    strokeStyle: "",
    lineWidth: 0,
    lineJoin: "",
    font: "",
    textAlign: "",
    textBaseline: "",
  };
  return { ctx: ctx as unknown as CanvasRenderingContext2D, fills };
}

// Consistency test: the screen drawer and the PNG export draw the same tag from lib/markup/remark-marker.ts.
describe("remark markers on screen and in the export", () => {
  const matrix: Affine2x3 = [
    [0.25, 0, 0],
    [0, -0.25, 1000],
  ];
  it("draws on screen the outline the module gives, tip on the anchor, coloured by state", () => {
    const { ctx, fills } = recordingContext();
    remarkMarkersDrawer(
      [
        { id: "a", pin: [1200, 1200], status: "open" },
        { id: "b", pin: [400, 800], status: "resolved" },
      ],
      null,
    )(ctx, matrix);
    const size = REMARK_MARKER_SIZES.screenPx;
    expect(fills).toEqual([
      `${remarkMarkerPath(remarkMarkerShape(size, 1), 300, 700)}|${REMARK_MARKER_STYLES.open.plate}`,
      `${remarkMarkerPath(remarkMarkerShape(size, 2), 100, 800)}|${REMARK_MARKER_STYLES.closed.plate}`,
    ]);
  });

  it("prints the same outline in the export's SVG, at the export's size", () => {
    const svg = markupLayerSvg([], matrix, 1600, { labels: false, threads: [{ at: [1200, 1200], open: false, number: 3 }] });
    const d = /<path d="([^"]+)"/.exec(svg)![1];
    expect(d.startsWith("M300,700L")).toBe(true);
    expect(svg).toContain(`fill="${REMARK_MARKER_STYLES.closed.plate}"`);
    expect(svg).toContain(`stroke="${REMARK_MARKER_STYLES.closed.edge}"`);
  });
});
