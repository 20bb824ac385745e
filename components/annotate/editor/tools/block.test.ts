import { polygonArea, signedRingArea } from "@/lib/geometry/measure";
import { describe, expect, it } from "vitest";
import { setup, TOLERANCE_UM } from "../editor-test-kit";

describe("block tool", () => {
  it("closes on a click near the first vertex, counter-clockwise, named Block 1", () => {
    const t = setup();
    t.editor.setTool("block");
    // Clockwise on purpose: the stored ring is turned counter-clockwise (RFC 7946 §3.1.6).
    for (const [x, y] of [
      [200, 200],
      [200, 600],
      [800, 600],
      [800, 200],
    ])
      t.click(x, y);
    t.click(200 + TOLERANCE_UM / 2, 200);
    const [block] = t.ofKind("block");
    expect(block.geometry.coordinates[0]).toEqual([
      [200, 200],
      [800, 200],
      [800, 600],
      [200, 600],
      [200, 200],
    ]);
    expect(signedRingArea(block.geometry.coordinates[0])).toBeGreaterThan(0);
    expect(polygonArea(block.geometry)).toBe(600 * 400); // hand-worked: 600 µm × 400 µm
    expect(block.properties).toEqual({ name: "Block 1", function: "" });
    expect(t.selected()).toEqual([block.id]);
  });

  it("shows that the next click closes the block when the cursor is on the first vertex", () => {
    const t = setup();
    t.editor.setTool("block");
    for (const [x, y] of [
      [0, 0],
      [100, 0],
      [100, 100],
    ])
      t.click(x, y);
    t.move(50, 50);
    expect(t.state().toolPreview).toMatchObject({ type: "path", closesOnClick: false });
    t.move(0.5, 0.5);
    expect(t.state().toolPreview).toMatchObject({
      type: "path",
      closesOnClick: true,
      points: [
        [0, 0],
        [100, 0],
        [100, 100],
      ],
    });
  });

  it("closes with Enter only from three vertices on, and Backspace removes the last vertex", () => {
    const t = setup();
    t.editor.setTool("block");
    t.click(0, 0);
    t.click(100, 0);
    expect(t.key("Enter")).toBe(true);
    expect(t.ofKind("block")).toEqual([]);
    t.click(100, 100);
    t.click(50, 150);
    t.key("Backspace");
    expect(t.state().toolPreview).toMatchObject({
      points: [
        [0, 0],
        [100, 0],
        [100, 100],
      ],
    });
    t.key("Enter");
    const [block] = t.ofKind("block");
    // Hand-worked: right triangle with legs of 100 µm, area 5000 µm².
    expect(polygonArea(block.geometry)).toBe(5000);
  });

  it("goes back to its idle state when Backspace removes the only vertex", () => {
    const t = setup();
    t.editor.setTool("block");
    t.click(0, 0);
    t.key("Backspace");
    expect(t.state().toolState).toBe("block.idle");
    expect(t.state().toolPreview).toBeNull();
    expect(t.state().selection.size).toBe(0);
  });

  it("does not make a block from three vertices on one line", () => {
    const t = setup();
    t.editor.setTool("block");
    for (const [x, y] of [
      [0, 0],
      [100, 0],
      [200, 0],
    ])
      t.click(x, y);
    t.key("Enter");
    expect(t.ofKind("block")).toEqual([]);
    expect(t.state().drawing).toBe(true);
  });

  it("numbers blocks with the next free number", () => {
    const t = setup();
    for (let i = 0; i < 2; i++) {
      t.editor.setTool("block");
      for (const [x, y] of [
        [0, 0],
        [100, 0],
        [100, 100],
      ])
        t.click(x + 300 * i, y);
      t.key("Enter");
    }
    expect(t.ofKind("block").map((b) => b.properties.name)).toEqual(["Block 1", "Block 2"]);
  });
});
