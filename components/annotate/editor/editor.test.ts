import { describe, expect, it } from "vitest";
import { DUPLICATE_OFFSET_UM } from "./commands";
import { blockShape, bondShape, outlineShape, padShape, polygonOf, setup, TIME } from "./editor-test-kit";

const vcc = padShape("vcc", 60, 800);
const vee = padShape("vee", 60, 400);
const bond = bondShape("b1", vcc, [-300, 800]);

describe("editor commands", () => {
  it("deletes the selection with the Delete key and brings it back with undo", () => {
    const t = setup({ shapes: [vcc, vee] });
    t.editor.select(["vcc"]);
    expect(t.key("Delete")).toBe(true);
    expect(t.state().shapes.has("vcc")).toBe(false);
    expect(t.selected()).toEqual([]);
    expect(t.commits).toEqual([[{ before: vcc, after: null }]]);
    t.key("z", { ctrl: true });
    expect(t.shape("vcc")).toEqual(vcc);
    expect(t.commits[1]).toEqual([{ before: null, after: vcc }]);
  });

  it("nudges by 1 µm, 10 µm with Shift, with ArrowUp as +y", () => {
    const t = setup({ shapes: [vee] });
    t.editor.select(["vee"]);
    t.key("ArrowUp");
    t.key("ArrowRight", { shift: true });
    t.key("ArrowDown");
    t.key("ArrowLeft");
    // Hand-worked: (+1 up) + (+10 right) + (−1 down) + (−1 left) = (+9, 0) from (20, 360).
    expect(polygonOf(t.shape("vee")).coordinates[0][0]).toEqual([29, 360]);
    expect(t.commits).toHaveLength(4);
  });

  it("leaves arrows to the viewer when nothing is selected", () => {
    const t = setup({ shapes: [vee] });
    expect(t.key("ArrowUp")).toBe(false);
    expect(t.shape("vee")).toEqual(vee);
  });

  it("duplicates with an offset, fresh pad labels and bonds on the copied pad", () => {
    const t = setup({ shapes: [vcc, bond, outlineShape("outline")] });
    t.editor.select(["vcc", "b1", "outline"]);
    t.key("d", { meta: true });
    const [dx, dy] = DUPLICATE_OFFSET_UM;
    const copies = t.selected().map((id) => t.shape(id)!);
    expect(copies.map((s) => s.kind)).toEqual(["pad", "wire_bond"]);
    const [padCopy, bondCopy] = copies;
    expect(polygonOf(padCopy).coordinates[0][0]).toEqual([20 + dx, 760 + dy]);
    expect(padCopy.properties).toMatchObject({ label: "P1" });
    expect(bondCopy.properties).toMatchObject({ padId: padCopy.id });
    expect(bondCopy.geometry.coordinates).toEqual([
      [60 + dx, 800 + dy],
      [-300 + dx, 800 + dy],
    ]);
    expect(t.commits).toHaveLength(1);
    expect(t.commits[0].every((c) => c.before === null)).toBe(true);
  });

  it("updates properties as one committed change and ignores a patch that changes nothing", () => {
    const t = setup({ shapes: [vcc] });
    t.editor.updateProperties("vcc", { net: "vcc", state: "probed" });
    expect(t.shape("vcc")?.properties).toEqual({ label: "VCC", net: "vcc", state: "probed" });
    t.editor.updateProperties("vcc", { net: "vcc" });
    t.editor.updateProperties("missing", { net: "x" });
    expect(t.commits).toEqual([[{ before: vcc, after: { ...vcc, properties: { label: "VCC", net: "vcc", state: "probed" }, updatedAt: TIME } }]]);
  });

  it("re-attaches a bond to the pad its padId is changed to", () => {
    const t = setup({ shapes: [vcc, vee, bond] });
    t.editor.updateProperties("b1", { padId: "vee" });
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 400]);
    expect(t.commits[0]).toHaveLength(1);
  });

  it("hands every commit's exact changes to onCommit, undo and redo included", () => {
    const t = setup({ shapes: [vcc, bond] });
    t.editor.select(["vcc"]);
    t.editor.nudge(0, -5);
    const movedPad = t.shape("vcc");
    const movedBond = t.shape("b1");
    t.editor.undo();
    t.editor.redo();
    expect(t.commits).toEqual([
      [
        { before: vcc, after: movedPad },
        { before: bond, after: movedBond },
      ],
      [
        { before: movedBond, after: bond },
        { before: movedPad, after: vcc },
      ],
      [
        { before: vcc, after: movedPad },
        { before: bond, after: movedBond },
      ],
    ]);
  });

  it("keeps redo when the selection changes", () => {
    const t = setup({ shapes: [vcc, vee] });
    t.editor.select(["vcc"]);
    t.editor.nudge(1, 0);
    t.editor.undo();
    t.click(60, 400);
    t.editor.select([]);
    expect(t.state().canRedo).toBe(true);
  });

  it("takes back only the drawing in progress when undo is pressed mid-drawing", () => {
    const t = setup({ shapes: [vcc] });
    t.editor.select(["vcc"]);
    t.editor.nudge(1, 0);
    t.editor.setTool("block");
    t.click(500, 500);
    t.key("z", { ctrl: true });
    expect(t.state().drawing).toBe(false);
    expect(polygonOf(t.shape("vcc")).coordinates[0][0]).toEqual([21, 760]);
    t.key("z", { ctrl: true });
    expect(t.shape("vcc")).toEqual(vcc);
  });

  it("leaves redo as it was when Escape cancels a drag", () => {
    const t = setup({ shapes: [vcc, vee] });
    t.editor.select(["vee"]);
    t.editor.nudge(5, 0);
    t.editor.undo();
    t.down(60, 800);
    t.move(200, 800);
    t.key("Escape");
    t.up(200, 800);
    expect(t.shape("vcc")).toEqual(vcc);
    expect(t.state().canRedo).toBe(true);
    expect(t.state().canUndo).toBe(false);
    t.editor.redo();
    expect(polygonOf(t.shape("vee")).coordinates[0][0]).toEqual([25, 360]);
  });

  it("lets the inspector edit a shape while a path is being drawn", () => {
    const t = setup({ shapes: [vcc] });
    t.editor.setTool("trace");
    t.click(500, 500);
    t.editor.updateProperties("vcc", { net: "vcc" });
    expect(t.state().drawing).toBe(true);
    t.click(700, 500);
    t.key("Enter");
    expect(t.commits).toHaveLength(2);
    t.editor.undo();
    expect(t.shape("vcc")?.properties.net).toBe("vcc");
  });

  it("does nothing with the pointer in the pan tool", () => {
    const t = setup({ shapes: [vcc] });
    t.key("m");
    t.drag([60, 800], [300, 300]);
    t.click(60, 800);
    expect(t.state().activeTool).toBe("pan");
    expect(t.selected()).toEqual([]);
    expect(t.commits).toEqual([]);
  });

  it("clears the selection on Escape when nothing is in progress, and closes help first", () => {
    const t = setup({ shapes: [vcc] });
    t.editor.select(["vcc"]);
    t.key("?");
    expect(t.state().helpVisible).toBe(true);
    t.key("Escape");
    expect(t.state().helpVisible).toBe(false);
    expect(t.selected()).toEqual(["vcc"]);
    t.key("Escape");
    expect(t.selected()).toEqual([]);
  });

  it("switches tools with single letters and cancels what the old tool was drawing", () => {
    const t = setup();
    t.key("b");
    t.click(0, 0);
    t.click(100, 0);
    t.key("T");
    expect(t.state().activeTool).toBe("trace");
    expect(t.state().toolPreview).toBeNull();
    expect(t.key("s", { ctrl: true })).toBe(false);
    expect(t.state().activeTool).toBe("trace");
  });
});

describe("read-only editor", () => {
  it("selects and pans but never changes or commits anything", () => {
    const shapes = [
      vcc,
      bond,
      blockShape("lna", [
        [200, 200],
        [800, 200],
        [800, 600],
        [200, 600],
      ]),
    ];
    const t = setup({ shapes, canEdit: false });
    t.click(60, 820);
    expect(t.selected()).toEqual(["vcc"]);
    t.drag([60, 820], [300, 300]);
    t.drag([100, 840], [200, 900]);
    t.drag([1000, 1000], [1500, 1500]);
    t.key("Delete");
    t.key("ArrowUp");
    t.key("d", { ctrl: true });
    t.editor.nudge(5, 5);
    t.editor.deleteSelection();
    t.editor.duplicateSelection();
    t.editor.updateProperties("vcc", { net: "x" });
    for (const tool of ["pad", "block", "note", "die_outline"] as const) {
      t.editor.setTool(tool);
      t.click(1000, 1000);
    }
    expect(t.key("p")).toBe(false);
    t.editor.setTool("pan");
    expect(t.state().activeTool).toBe("pan");
    t.editor.undo();
    expect(t.state().shapeList).toEqual(shapes);
    expect(t.commits).toEqual([]);
    expect(t.state().canUndo).toBe(false);
  });
});

describe("server echoes", () => {
  it("replace the version without recording history, and undo keeps the server's version", () => {
    const t = setup();
    t.editor.setTool("note");
    t.click(100, 100);
    const created = t.ofKind("note")[0];
    t.editor.applyServerShape({ ...created, version: 1 });
    expect(t.commits).toHaveLength(1);
    t.editor.updateProperties(created.id, { text: "probe mark" });
    t.editor.applyServerShape({ ...t.shape(created.id)!, version: 2 });
    t.editor.undo();
    expect(t.shape(created.id)).toEqual({ ...created, version: 2 });
    expect(t.commits[2]).toEqual([{ before: { ...created, version: 2, properties: { text: "probe mark" } }, after: { ...created, version: 2 } }]);
  });

  it("ignore an echo older than the shape held", () => {
    const t = setup({ shapes: [{ ...vcc, version: 5 }] });
    t.editor.applyServerShape({ ...vcc, version: 4, properties: { ...vcc.properties, net: "stale" } });
    expect(t.shape("vcc")?.version).toBe(5);
    expect(t.shape("vcc")?.properties.net).toBe("");
  });

  it("update the starting point of a drag in progress", () => {
    const t = setup({ shapes: [vcc] });
    t.down(60, 800);
    t.move(60, 900);
    t.editor.applyServerShape({ ...vcc, version: 2 });
    t.up(60, 900);
    expect(t.commits[0]).toEqual([{ before: { ...vcc, version: 2 }, after: t.shape("vcc") }]);
    expect(t.shape("vcc")?.version).toBe(2);
  });

  it("remove a shape without recording history", () => {
    const t = setup({ shapes: [vcc, vee] });
    t.editor.select(["vcc", "vee"]);
    t.editor.removeServerShape("vcc");
    expect(t.state().shapes.has("vcc")).toBe(false);
    expect(t.selected()).toEqual(["vee"]);
    expect(t.commits).toEqual([]);
    expect(t.state().canUndo).toBe(false);
  });
});

describe("state snapshots", () => {
  it("are the same object until something changes, and listeners hear once per event", () => {
    const t = setup({ shapes: [vcc] });
    let calls = 0;
    const stop = t.editor.subscribe(() => calls++);
    const first = t.state();
    expect(t.state()).toBe(first);
    t.drag([60, 800], [70, 810]);
    expect(t.state()).not.toBe(first);
    expect(calls).toBe(5);
    stop();
    t.editor.nudge(1, 1);
    expect(calls).toBe(5);
  });
});
