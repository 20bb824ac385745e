import { describe, expect, it } from "vitest";
import { outlineShape, setup } from "../editor-test-kit";

describe("die outline tool", () => {
  it("replaces the existing outline in one history entry", () => {
    const old = outlineShape("outline");
    const t = setup({ shapes: [old] });
    t.editor.setTool("die_outline");
    t.drag([0, 0], [2400, 1600]);
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
});
