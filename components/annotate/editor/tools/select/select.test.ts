import { describe, expect, it } from "vitest";
import { blockShape, outlineShape, padShape, polygonOf, setup, traceShape } from "../../editor-test-kit";

const lnaBlock = blockShape("lna", [
  [200, 200],
  [800, 200],
  [800, 600],
  [200, 600],
]);
const vb1 = padShape("vb1", 400, 400);
const vb2 = padShape("vb2", 1400, 400);
const spiral = traceShape(
  "spiral",
  [
    [1000, 1000],
    [1200, 1000],
    [1200, 1200],
  ],
  10,
);

describe("select tool: clicking", () => {
  it("selects the smaller of two shapes under the pointer", () => {
    const t = setup({ shapes: [lnaBlock, vb1] });
    t.click(400, 400);
    expect(t.selected()).toEqual(["vb1"]);
    t.click(250, 250);
    expect(t.selected()).toEqual(["lna"]);
  });

  it("hits a trace within half its width plus the tolerance", () => {
    const t = setup({ shapes: [spiral] });
    // Hand-worked: 5 µm half width + 2 µm tolerance = 7 µm from the centre line.
    t.click(1100, 1006.9);
    expect(t.selected()).toEqual(["spiral"]);
    t.click(1100, 1007.2);
    expect(t.selected()).toEqual([]);
  });

  it("hits the die outline only near its edge, so clicks inside reach the die's shapes", () => {
    const t = setup({ shapes: [outlineShape("outline")] });
    t.click(1200, 800);
    expect(t.selected()).toEqual([]);
    t.click(1200, 1601);
    expect(t.selected()).toEqual(["outline"]);
  });

  it("toggles shapes with Shift and clears the selection on empty space", () => {
    const t = setup({ shapes: [vb1, vb2] });
    t.click(400, 400);
    t.click(1400, 400, { shift: true });
    expect(t.selected()).toEqual(["vb1", "vb2"]);
    t.click(400, 400, { shift: true });
    expect(t.selected()).toEqual(["vb2"]);
    t.click(2000, 1500, { shift: true });
    expect(t.selected()).toEqual(["vb2"]);
    t.click(2000, 1500);
    expect(t.selected()).toEqual([]);
    expect(t.commits).toEqual([]);
  });

  it("highlights the shape under the pointer", () => {
    const t = setup({ shapes: [vb1] });
    t.move(410, 390);
    expect(t.state().hoverId).toBe("vb1");
    t.move(900, 900);
    expect(t.state().hoverId).toBeNull();
  });
});

describe("select tool: box selection", () => {
  it("selects the shapes whose bounding box lies inside the box", () => {
    const t = setup({ shapes: [lnaBlock, vb1, vb2] });
    // The press must be on empty space: inside the block it would grab the block.
    t.down(150, 300);
    t.move(450, 450);
    t.move(900, 700);
    expect(t.state().toolPreview).toEqual({ type: "box", box: { minX: 150, minY: 300, maxX: 900, maxY: 700 } });
    t.up(900, 700);
    // The pad (360…440 × 360…440) is inside; the block (200…800 × 200…600) is not.
    expect(t.selected()).toEqual(["vb1"]);
    expect(t.state().toolPreview).toBeNull();
  });

  it("adds to the selection with Shift", () => {
    const t = setup({ shapes: [lnaBlock, vb1, vb2] });
    t.click(1400, 400);
    t.drag([100, 100], [900, 700], { shift: true });
    expect(t.selected().sort()).toEqual(["lna", "vb1", "vb2"]);
  });

  it("puts the selection back when cancelled", () => {
    const t = setup({ shapes: [vb1, vb2] });
    t.click(1400, 400);
    t.down(100, 100);
    t.move(900, 700);
    expect(t.selected()).toEqual(["vb1"]);
    t.editor.cancel();
    expect(t.selected()).toEqual(["vb2"]);
    expect(t.state().toolState).toBe("select.idle");
  });
});

describe("select tool: moving", () => {
  it("moves the selection by the drag in one history entry", () => {
    const t = setup({ shapes: [vb1, vb2] });
    t.click(400, 400);
    t.click(1400, 400, { shift: true });
    t.drag([400, 400], [430, 380]);
    // Hand-worked: both pads move by (+30, −20).
    expect(polygonOf(t.shape("vb1")).coordinates[0][0]).toEqual([390, 340]);
    expect(polygonOf(t.shape("vb2")).coordinates[0][0]).toEqual([1390, 340]);
    expect(t.commits).toHaveLength(1);
    expect(t.commits[0]).toEqual([
      { before: vb1, after: t.shape("vb1") },
      { before: vb2, after: t.shape("vb2") },
    ]);
    t.editor.undo();
    expect(t.shape("vb1")).toEqual(vb1);
    expect(t.shape("vb2")).toEqual(vb2);
  });

  it("drags an unselected shape straight away, selecting it", () => {
    const t = setup({ shapes: [vb1, vb2] });
    t.click(1400, 400);
    t.drag([400, 400], [400, 500]);
    expect(t.selected()).toEqual(["vb1"]);
    expect(polygonOf(t.shape("vb1")).coordinates[0][0]).toEqual([360, 460]);
    expect(t.shape("vb2")).toEqual(vb2);
  });

  it("moves a selected block even when the press lands on a pad inside it", () => {
    const t = setup({ shapes: [lnaBlock, vb1] });
    t.click(250, 250);
    t.drag([400, 400], [500, 400]);
    expect(polygonOf(t.shape("lna")).coordinates[0][0]).toEqual([300, 200]);
    expect(t.shape("vb1")).toEqual(vb1);
  });

  it("keeps a Shift drag horizontal or vertical", () => {
    const t = setup({ shapes: [vb1] });
    t.drag([400, 400], [500, 430], { shift: true });
    expect(polygonOf(t.shape("vb1")).coordinates[0][0]).toEqual([460, 360]);
  });

  it("puts shapes back and records nothing when Escape cancels a drag", () => {
    const t = setup({ shapes: [vb1] });
    t.down(400, 400);
    t.move(600, 600);
    expect(polygonOf(t.shape("vb1")).coordinates[0][0]).toEqual([560, 560]);
    t.key("Escape");
    t.up(600, 600);
    expect(t.shape("vb1")).toEqual(vb1);
    expect(t.commits).toEqual([]);
    expect(t.state().canUndo).toBe(false);
  });

  it("does not move anything for a press within the tolerance", () => {
    const t = setup({ shapes: [vb1] });
    t.drag([400, 400], [401, 400]);
    expect(t.shape("vb1")).toEqual(vb1);
    expect(t.selected()).toEqual(["vb1"]);
    expect(t.commits).toEqual([]);
  });
});
