import { describe, expect, it } from "vitest";
import { bondShape, padShape, setup } from "../editor-test-kit";

describe("wire bond tool", () => {
  it("pulls a bond from the pad's centre to the release point, attached to the pad", () => {
    const pad = padShape("vcc", 60, 800);
    const t = setup({ shapes: [pad] });
    t.editor.setTool("wire_bond");
    t.drag([70, 810], [-300, 800]);
    const [bond] = t.ofKind("wire_bond");
    // Hand-worked: the pad spans 20…100 × 760…840, so its centre is (60, 800).
    expect(bond.geometry).toEqual({
      type: "LineString",
      coordinates: [
        [60, 800],
        [-300, 800],
      ],
    });
    expect(bond.properties).toEqual({ diameterUm: 25, padId: "vcc" });
    expect(t.selected()).toEqual([bond.id]);
    expect(t.state().activeTool).toBe("select");
  });

  it("starts nothing away from a pad and makes nothing when released on the centre", () => {
    const t = setup({ shapes: [padShape("vcc", 60, 800)] });
    t.editor.setTool("wire_bond");
    t.drag([600, 600], [900, 600]);
    t.drag([60, 800], [60.5, 800]);
    expect(t.ofKind("wire_bond")).toEqual([]);
    expect(t.commits).toEqual([]);
  });

  it("keeps its foot on the pad centre when the pad is dragged, in the same history entry", () => {
    const pad = padShape("vcc", 60, 800);
    const bond = bondShape("b1", pad, [-300, 800]);
    const t = setup({ shapes: [pad, bond] });
    t.drag([60, 820], [160, 720]);
    // Hand-worked: the pad moved by (+100, −100), so its centre is (160, 700).
    expect(t.shape("b1")?.geometry.coordinates).toEqual([
      [160, 700],
      [-300, 800],
    ]);
    expect(t.commits).toHaveLength(1);
    expect(t.commits[0].map((c) => c.after?.id).sort()).toEqual(["b1", "vcc"]);
    t.editor.undo();
    expect(t.shape("b1")).toEqual(bond);
    expect(t.shape("vcc")).toEqual(pad);
  });

  it("follows a nudge and a resize of its pad", () => {
    const pad = padShape("vcc", 60, 800);
    const t = setup({ shapes: [pad, bondShape("b1", pad, [-300, 800])] });
    t.editor.select(["vcc"]);
    t.key("ArrowUp", { shift: true });
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 810]);
    // Drag the upper-right corner (100, 850) to (140, 890): the pad becomes 20…140 × 770…890.
    t.drag([100, 850], [140, 890]);
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([80, 830]);
    t.editor.undo();
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 810]);
    t.editor.undo();
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 800]);
    t.editor.redo();
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 810]);
  });

  it("swings only its free end when the bond alone is dragged", () => {
    const pad = padShape("vcc", 60, 800);
    const t = setup({ shapes: [pad, bondShape("b1", pad, [-300, 800])] });
    t.click(-200, 800);
    expect(t.selected()).toEqual(["b1"]);
    t.drag([-200, 800], [-200, 900]);
    expect(t.shape("b1")?.geometry.coordinates).toEqual([
      [60, 800],
      [-300, 900],
    ]);
  });

  it("moves its foot to another pad only with a message, one undo step putting it back", () => {
    const vcc = padShape("vcc", 60, 800);
    const vee = padShape("vee", 60, 400);
    const bond = bondShape("b1", vcc, [-300, 800]);
    const t = setup({ shapes: [vcc, vee, bond] });
    t.editor.select(["b1"]);
    t.drag([60, 800], [70, 410]);
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 400]);
    expect(t.shape("b1")?.properties.padId).toBe("vee");
    expect(t.state().notice).toBe("Wire bond moved from pad VCC to pad VEE. Undo (Ctrl+Z) puts it back.");
    t.editor.undo();
    expect(t.shape("b1")).toEqual(bond);
    expect(t.state().notice).toBeNull();
    t.editor.select(["b1"]);
    t.drag([60, 800], [300, 300]);
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([300, 300]);
    expect(t.shape("b1")?.properties.padId).toBeNull();
    expect(t.state().notice).toMatch(/^Wire bond detached from pad VCC/);
  });

  it("says nothing when the foot is dropped back on its own pad", () => {
    const vcc = padShape("vcc", 60, 800);
    const t = setup({ shapes: [vcc, padShape("vee", 60, 400), bondShape("b1", vcc, [-300, 800])] });
    t.editor.select(["b1"]);
    t.drag([60, 800], [75, 790]);
    expect(t.shape("b1")?.properties.padId).toBe("vcc");
    expect(t.shape("b1")?.geometry.coordinates[0]).toEqual([60, 800]);
    expect(t.state().notice).toBeNull();
  });
});
