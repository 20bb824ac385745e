import { describe, expect, it } from "vitest";
import { outlineShape, padShape, polygonOf, setup } from "./editor-test-kit";
import { rectangleAround } from "./rectangle";

// Consistency tests of the editor's own history (undo returns to the state before the step).
describe("adding found shapes and a proposed die outline", () => {
  it("adds many pads in one history entry, selected, and one undo takes them all back", () => {
    const t = setup({ shapes: [padShape("p1", 110, 1530)] });
    const drafts = [410, 710, 1010].map((x) => ({
      kind: "pad" as const,
      geometry: rectangleAround([x, 1530], 80, 80),
      properties: { label: "", net: "", state: "unbonded" as const },
    }));
    t.editor.addShapes(drafts);
    expect(t.commits).toHaveLength(1);
    expect(t.commits[0]).toHaveLength(3);
    expect(t.ofKind("pad")).toHaveLength(4);
    expect(t.state().selection.size).toBe(3);
    t.editor.undo();
    expect(t.ofKind("pad").map((s) => s.id)).toEqual(["p1"]);
    t.editor.redo();
    expect(t.ofKind("pad")).toHaveLength(4);
  });

  it("adds nothing and records nothing for an empty list", () => {
    const t = setup();
    t.editor.addShapes([]);
    expect(t.commits).toEqual([]);
    expect(t.state().canUndo).toBe(false);
  });

  it("shows a proposed outline for confirmation; confirming replaces the old one in one entry, Escape drops it", () => {
    const old = outlineShape("outline");
    const t = setup({ shapes: [old] });
    const geometry = rectangleAround([1200, 800], 2400, 1600);
    t.editor.proposeDieOutline(geometry);
    expect(t.state().confirmation).toEqual({ kind: "die_outline", geometry, replaces: true });
    t.editor.cancel();
    expect(t.state().confirmation).toBeNull();
    expect(t.commits).toEqual([]);
    t.editor.proposeDieOutline(geometry);
    t.editor.confirm();
    expect(t.commits).toHaveLength(1);
    expect(polygonOf(t.ofKind("die_outline")[0])).toEqual(geometry);
    t.editor.undo();
    expect(t.ofKind("die_outline")).toEqual([old]);
  });
});
