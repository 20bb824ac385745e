import { describe, expect, it } from "vitest";
import { blockShape, bondShape, outlineShape, padShape, setup } from "../../editor-test-kit";

// The invented NV-24R die: pad VCC at (60, 800) with its bond running off the left edge, the
// neighbouring pad VEE 120 µm below, both inside an input block.
const vcc = padShape("vcc", 60, 800);
const vee = padShape("vee", 60, 680);
const bond = bondShape("b1", vcc, [-300, 800]);
const block = blockShape(
  "io",
  [
    [0, 600],
    [200, 600],
    [200, 900],
    [0, 900],
  ],
  "Input",
);

describe("select tool: shapes stacked under the pointer", () => {
  it("selects the pad, not its bond's foot, on a click at the pad's centre", () => {
    const t = setup({ shapes: [vcc, vee, bond, block] });
    t.click(60, 800);
    expect(t.selected()).toEqual(["vcc"]);
    // The bond is still one click away on its wire, off the pad.
    t.click(-100, 800);
    expect(t.selected()).toEqual(["b1"]);
  });

  it("drags the pad from its centre; the bond follows and keeps its pad", () => {
    const t = setup({ shapes: [vcc, vee, bond, block] });
    t.drag([60, 800], [60, 690]);
    // Hand-worked: the pad moved by (0, −110) to centre (60, 690), overlapping VEE's centre row.
    expect(t.shape("vcc")?.geometry).toMatchObject({
      coordinates: [
        [
          [20, 650],
          [100, 650],
          [100, 730],
          [20, 730],
          [20, 650],
        ],
      ],
    });
    expect(t.shape("b1")?.geometry.coordinates).toEqual([
      [60, 690],
      [-300, 800],
    ]);
    expect(t.shape("b1")?.properties.padId).toBe("vcc");
    expect(t.state().notice).toBeNull();
  });

  it("cycles through the stack on repeated clicks at the same spot, and with Alt", () => {
    const t = setup({ shapes: [vcc, vee, bond, block] });
    t.click(60, 800);
    expect(t.selected()).toEqual(["vcc"]);
    t.click(60.5, 800);
    expect(t.selected()).toEqual(["b1"]);
    t.click(60, 800.5);
    expect(t.selected()).toEqual(["io"]);
    t.click(60, 800);
    expect(t.selected()).toEqual(["vcc"]);
    // Elsewhere the first click starts from the best shape again.
    t.click(150, 700);
    expect(t.selected()).toEqual(["io"]);
    t.editor.select(["vcc"]);
    t.click(70, 800, { alt: true });
    expect(t.selected()).toEqual(["b1"]);
  });
});

describe("shapes drawn outside the die", () => {
  it("warns when a pad is drawn or moved off the die outline", () => {
    const t = setup({ shapes: [outlineShape("outline")] });
    t.editor.setTool("pad");
    t.click(-200, 800);
    expect(t.state().notice).toBe(
      "Pad P1 lies outside the die outline. Pads off the die are left out of the pad numbering unless you include them in the Selection tab.",
    );
    t.editor.dismissNotice();
    t.editor.setTool("pad");
    t.click(60, 800);
    expect(t.state().notice).toBeNull();
    t.drag([60, 800], [2600, 800]);
    expect(t.state().notice).toMatch(/^Pad P2 lies outside the die outline/);
  });

  it("uses the die's recorded size when no outline is drawn, and says nothing without either", () => {
    const sized = setup({ shapes: [] });
    sized.editor.setTool("pad");
    sized.click(-200, 800);
    expect(sized.state().notice).toBeNull();
  });
});
