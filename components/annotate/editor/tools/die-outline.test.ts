import { describe, expect, it } from "vitest";
import { createEditor } from "../editor";
import { outlineShape, padShape, setup, TIME } from "../editor-test-kit";

describe("die outline tool", () => {
  it("replaces the existing outline in one history entry", () => {
    const old = outlineShape("outline");
    const t = setup({ shapes: [old] });
    t.editor.setTool("die_outline");
    t.drag([0, 0], [2400, 1600]);
    t.editor.confirm();
    const outlines = t.ofKind("die_outline");
    expect(outlines).toHaveLength(1);
    expect(outlines[0].id).not.toBe("outline");
    expect(t.commits).toHaveLength(1);
    expect(t.commits[0]).toEqual([
      { before: old, after: null },
      { before: null, after: outlines[0] },
    ]);
    t.editor.undo();
    expect([...t.state().shapes.values()]).toEqual([old]);
  });

  it("makes nothing from a click", () => {
    const t = setup();
    t.editor.setTool("die_outline");
    t.click(100, 100);
    expect(t.state().shapes.size).toBe(0);
    expect(t.state().activeTool).toBe("die_outline");
    expect(t.commits).toEqual([]);
  });

  it("waits for confirmation before re-framing, and Escape drops the outline without history", () => {
    const t = setup();
    t.editor.setTool("die_outline");
    t.drag([3, 4], [2397, 1597]);
    expect(t.state().confirmation).toEqual({
      kind: "die_outline",
      geometry: {
        type: "Polygon",
        coordinates: [
          [
            [3, 4],
            [2397, 4],
            [2397, 1597],
            [3, 1597],
            [3, 4],
          ],
        ],
      },
      replaces: false,
    });
    expect(t.state().toolPreview?.type).toBe("shape");
    expect(t.commits).toEqual([]);
    t.editor.cancel();
    expect(t.state().confirmation).toBeNull();
    expect(t.state().toolPreview).toBeNull();
    expect(t.state().shapes.size).toBe(0);
    expect(t.state().canUndo).toBe(false);
    t.drag([3, 4], [2397, 1597]);
    t.editor.confirm();
    expect(t.ofKind("die_outline")).toHaveLength(1);
    expect(t.commits).toHaveLength(1);
    expect(t.state().confirmation).toBeNull();
  });

  it("offers the host's undo step once its own history is used up (restoring the die frame)", () => {
    let restored = 0;
    const editor = createEditor({
      shapes: [outlineShape("outline")],
      canEdit: true,
      newId: () => "n1",
      now: () => TIME,
      userId: "analyst",
      undoBeyondHistory: () => restored++,
    });
    // Reloaded after a re-framing: nothing in the history, yet Undo is offered.
    expect(editor.getState().canUndo).toBe(true);
    editor.nudge(10, 0);
    editor.select(["outline"]);
    editor.nudge(10, 0);
    editor.undo();
    expect(restored).toBe(0);
    editor.undo();
    expect(restored).toBe(1);
    expect(editor.getState().canUndo).toBe(false);
    editor.undo();
    expect(restored).toBe(1);
    const readOnly = createEditor({
      shapes: [padShape("p", 0, 0)],
      canEdit: false,
      newId: () => "n",
      now: () => TIME,
      userId: null,
      undoBeyondHistory: () => restored++,
    });
    expect(readOnly.getState().canUndo).toBe(false);
  });
});
