import { describe, expect, it } from "vitest";
import { setup } from "../editor-test-kit";

describe("trace tool", () => {
  it("finishes on a double click with the clicked centre line and a 5 µm width", () => {
    const t = setup();
    t.editor.setTool("trace");
    t.click(100, 100);
    t.click(300, 100);
    t.doubleClick(300, 250);
    const [trace] = t.ofKind("trace");
    expect(trace.geometry.coordinates).toEqual([
      [100, 100],
      [300, 100],
      [300, 250],
    ]);
    expect(trace.properties).toEqual({ widthUm: 5 });
    expect(t.selected()).toEqual([trace.id]);
    expect(t.commits).toHaveLength(1);
  });

  it("needs two vertices before Enter finishes", () => {
    const t = setup();
    t.editor.setTool("trace");
    t.click(100, 100);
    t.key("Enter");
    expect(t.ofKind("trace")).toEqual([]);
    t.click(100, 400);
    t.key("Enter");
    expect(t.ofKind("trace")[0].geometry.coordinates).toEqual([
      [100, 100],
      [100, 400],
    ]);
  });
});

describe("ruler tool", () => {
  it("shows the live length of the path to the cursor", () => {
    const t = setup();
    t.editor.setTool("ruler");
    t.click(0, 0);
    t.move(30, 40);
    // Hand-worked 3-4-5 right triangle scaled by 10: √(30² + 40²) = 50 µm.
    expect(t.state().toolPreview).toMatchObject({ type: "path", kind: "ruler", lengthUm: 50 });
    t.click(30, 40);
    t.move(30, 0);
    // Hand-worked: 50 + 40 = 90 µm along the two legs.
    expect(t.state().toolPreview).toMatchObject({ lengthUm: 90 });
    t.key("Enter");
    const [ruler] = t.ofKind("ruler");
    expect(ruler.geometry.coordinates).toEqual([
      [0, 0],
      [30, 40],
    ]);
    expect(ruler.properties).toEqual({});
  });

  it("measures from a single drag", () => {
    const t = setup();
    t.editor.setTool("ruler");
    t.drag([0, 0], [300, 400]);
    // Hand-worked 3-4-5 triangle scaled by 100: 500 µm.
    expect(t.state().toolPreview).toMatchObject({
      points: [
        [0, 0],
        [300, 400],
      ],
      lengthUm: 500,
    });
    t.doubleClick(300, 400);
    expect(t.ofKind("ruler")[0].geometry.coordinates).toEqual([
      [0, 0],
      [300, 400],
    ]);
  });
});

describe("symmetry axis tool", () => {
  it("places an axis with two clicks", () => {
    const t = setup();
    t.editor.setTool("symmetry_axis");
    t.click(0, 800);
    t.click(2400, 800);
    const [axis] = t.ofKind("symmetry_axis");
    expect(axis.geometry).toEqual({
      type: "LineString",
      coordinates: [
        [0, 800],
        [2400, 800],
      ],
    });
    expect(axis.properties).toEqual({ name: "Axis 1" });
  });

  it("replaces the existing axis in one entry, and keeps it with Shift", () => {
    const t = setup();
    t.editor.setTool("symmetry_axis");
    t.drag([0, 800], [2400, 800]);
    const first = t.ofKind("symmetry_axis")[0];
    t.editor.setTool("symmetry_axis");
    t.click(0, 810);
    t.click(2400, 810);
    expect(t.ofKind("symmetry_axis").map((a) => a.geometry.coordinates[0])).toEqual([[0, 810]]);
    expect(t.commits[1].map((c) => [c.before?.id ?? null, c.after?.id ?? null])).toEqual([
      [first.id, null],
      [null, t.ofKind("symmetry_axis")[0].id],
    ]);
    t.editor.setTool("symmetry_axis");
    t.click(1200, 0, { shift: true });
    t.click(1200, 1600);
    expect(t.ofKind("symmetry_axis").map((a) => a.properties.name)).toEqual(["Axis 1", "Axis 2"]);
  });
});

describe("escape while drawing", () => {
  it("cancels the drawing and leaves redo as it was", () => {
    const t = setup();
    t.editor.setTool("trace");
    t.click(0, 0);
    t.click(0, 100);
    t.key("Enter");
    t.editor.undo();
    expect(t.state().canRedo).toBe(true);
    t.editor.setTool("trace");
    t.click(500, 500);
    t.click(600, 500);
    t.key("Escape");
    expect(t.state().toolPreview).toBeNull();
    expect(t.state().toolState).toBe("trace.idle");
    expect(t.ofKind("trace")).toEqual([]);
    expect(t.state().canRedo).toBe(true);
    t.editor.redo();
    expect(t.ofKind("trace")[0].geometry.coordinates).toEqual([
      [0, 0],
      [0, 100],
    ]);
  });
});
