import { polygonArea } from "@/lib/geometry/measure";
import { describe, expect, it } from "vitest";
import { blockShape, padShape, polygonOf, setup, traceShape } from "../../editor-test-kit";

const pad = padShape("rf_in", 60, 800);
const block = blockShape(
  "mixer",
  [
    [1000, 200],
    [1600, 200],
    [1600, 600],
    [1000, 600],
  ],
  "Mixer",
);
const trace = traceShape("peaking", [
  [0, 0],
  [100, 0],
  [100, 100],
]);

describe("select tool: resizing rectangles", () => {
  it("resizes a pad by a corner, the opposite corner staying put", () => {
    const t = setup({ shapes: [pad] });
    t.click(60, 800);
    // Pad 20…100 × 760…840; the lower-left corner (20, 760) goes to (0, 700).
    t.drag([21, 761], [1, 701]);
    expect(t.shape("rf_in")?.geometry.coordinates[0]).toEqual([
      [0, 700],
      [100, 700],
      [100, 840],
      [0, 840],
      [0, 700],
    ]);
    expect(polygonArea(polygonOf(t.shape("rf_in")))).toBe(100 * 140); // hand-worked
    expect(t.commits).toHaveLength(1);
  });

  it("flips through the fixed corner without becoming thinner than the tolerance", () => {
    const t = setup({ shapes: [pad] });
    t.click(60, 800);
    t.drag([100, 840], [20, 700]);
    // The corner went past the fixed one on y and onto it on x: width clamps to the 2 µm tolerance.
    expect(t.shape("rf_in")?.geometry.coordinates[0]).toEqual([
      [20, 700],
      [22, 700],
      [22, 760],
      [20, 760],
      [20, 700],
    ]);
  });

  it("offers corner handles only on a single selection", () => {
    const t = setup({ shapes: [pad, padShape("vcc", 60, 400)] });
    t.click(60, 800);
    t.click(60, 400, { shift: true });
    t.drag([100, 840], [150, 900]);
    // Both pads move instead: the press landed on the selection, not on a handle.
    expect(polygonOf(t.shape("rf_in")).coordinates[0][0]).toEqual([70, 820]);
    expect(polygonOf(t.shape("vcc")).coordinates[0][0]).toEqual([70, 420]);
  });
});

describe("select tool: vertices", () => {
  it("drags one vertex of a block", () => {
    const t = setup({ shapes: [block] });
    t.click(1300, 400);
    t.drag([1600, 600], [1700, 700]);
    expect(t.shape("mixer")?.geometry.coordinates[0]).toEqual([
      [1000, 200],
      [1600, 200],
      [1700, 700],
      [1000, 600],
      [1000, 200],
    ]);
  });

  it("adds a vertex on an edge with Alt, on the edge itself", () => {
    const t = setup({ shapes: [block] });
    t.click(1300, 400);
    t.click(1300, 201, { alt: true });
    // Hand-worked: (1300, 201) projects onto the bottom edge at (1300, 200).
    expect(t.shape("mixer")?.geometry.coordinates[0]).toEqual([
      [1000, 200],
      [1300, 200],
      [1600, 200],
      [1600, 600],
      [1000, 600],
      [1000, 200],
    ]);
    expect(polygonArea(polygonOf(t.shape("mixer")))).toBe(600 * 400);
  });

  it("removes a vertex with Alt but keeps at least three for a block", () => {
    const t = setup({ shapes: [block] });
    t.click(1300, 400);
    t.click(1600, 600, { alt: true });
    expect(t.shape("mixer")?.geometry.coordinates[0]).toEqual([
      [1000, 200],
      [1600, 200],
      [1000, 600],
      [1000, 200],
    ]);
    // Hand-worked: right triangle with legs 600 and 400, area 120 000 µm².
    expect(polygonArea(polygonOf(t.shape("mixer")))).toBe(120_000);
    t.click(1000, 600, { alt: true });
    expect(t.shape("mixer")?.geometry.coordinates[0]).toHaveLength(4);
    expect(t.commits).toHaveLength(1);
  });

  it("adds, drags and removes trace vertices down to two", () => {
    const t = setup({ shapes: [trace] });
    t.click(50, 0);
    t.click(100, 50, { alt: true });
    expect(t.shape("peaking")?.geometry.coordinates).toEqual([
      [0, 0],
      [100, 0],
      [100, 50],
      [100, 100],
    ]);
    t.drag([100, 50], [150, 50]);
    expect(t.shape("peaking")?.geometry.coordinates).toEqual([
      [0, 0],
      [100, 0],
      [150, 50],
      [100, 100],
    ]);
    t.click(150, 50, { alt: true });
    t.click(100, 0, { alt: true });
    expect(t.shape("peaking")?.geometry.coordinates).toEqual([
      [0, 0],
      [100, 100],
    ]);
    t.click(0, 0, { alt: true });
    expect(t.shape("peaking")?.geometry.coordinates).toEqual([
      [0, 0],
      [100, 100],
    ]);
    expect(t.commits).toHaveLength(4);
  });
});
