import { polygonArea, signedRingArea } from "@/lib/geometry/measure";
import { describe, expect, it } from "vitest";
import { padShape, polygonOf, setup, TOLERANCE_UM } from "../editor-test-kit";

describe("pad tool", () => {
  it("creates an axis-aligned pad from a dragged rectangle, selects it and returns to select", () => {
    const t = setup();
    t.editor.setTool("pad");
    t.drag([100, 200], [180, 140]);
    const [pad] = t.ofKind("pad");
    // Hand-worked: corners (100, 140) and (180, 200), listed counter-clockwise from the lower left.
    expect(pad.geometry.coordinates).toEqual([
      [
        [100, 140],
        [180, 140],
        [180, 200],
        [100, 200],
        [100, 140],
      ],
    ]);
    expect(signedRingArea(pad.geometry.coordinates[0])).toBeGreaterThan(0);
    expect(polygonArea(pad.geometry)).toBe(80 * 60); // hand-worked: 80 µm × 60 µm
    expect(pad.properties).toEqual({ label: "P1", net: "", state: "unbonded" });
    expect(pad.createdBy).toBe("analyst");
    expect(t.selected()).toEqual([pad.id]);
    expect(t.state().activeTool).toBe("select");
    expect(t.state().toolPreview).toBeNull();
  });

  it("creates an 80 × 80 µm pad centred on a click", () => {
    const t = setup();
    t.editor.setTool("pad");
    t.click(500, 60);
    const [pad] = t.ofKind("pad");
    // Hand-worked: 500 ± 40 and 60 ± 40.
    expect(pad.geometry.coordinates[0]).toEqual([
      [460, 20],
      [540, 20],
      [540, 100],
      [460, 100],
      [460, 20],
    ]);
  });

  it("treats a rectangle thinner than the tolerance as a click", () => {
    const t = setup();
    t.editor.setTool("pad");
    t.drag([500, 60], [700, 60 + TOLERANCE_UM / 2]);
    const [pad] = t.ofKind("pad");
    expect(polygonArea(pad.geometry)).toBe(6400); // the default 80 × 80 µm pad
  });

  it("labels new pads with the next free number", () => {
    const t = setup({ shapes: [padShape("a", 60, 1400, 80, { label: "P1" }), padShape("b", 60, 1000, 80, { label: "P3" })] });
    t.editor.setTool("pad");
    t.click(60, 600);
    t.editor.setTool("pad");
    t.click(60, 200);
    expect(t.ofKind("pad").map((p) => p.properties.label)).toEqual(["P1", "P3", "P2", "P4"]);
  });

  it("previews the pad being dragged exactly as it will be created", () => {
    const t = setup();
    t.editor.setTool("pad");
    t.down(0, 0);
    t.move(40, 30);
    const preview = t.state().toolPreview;
    expect(preview?.type === "shape" && preview.shape.kind).toBe("pad");
    expect(polygonArea(polygonOf(preview?.type === "shape" ? preview.shape : null))).toBe(1200);
    t.up(40, 30);
    expect(t.commits).toHaveLength(1);
    expect(t.commits[0]).toEqual([{ before: null, after: t.ofKind("pad")[0] }]);
  });
});
