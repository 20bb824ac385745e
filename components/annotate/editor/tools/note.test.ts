import { describe, expect, it } from "vitest";
import { setup } from "../editor-test-kit";

describe("note tool", () => {
  it("places an empty note at the click and selects it", () => {
    const t = setup();
    t.editor.setTool("note");
    t.click(1200, 820);
    const [note] = t.ofKind("note");
    expect(note.geometry).toEqual({ type: "Point", coordinates: [1200, 820] });
    expect(note.properties).toEqual({ text: "" });
    expect(t.selected()).toEqual([note.id]);
    t.editor.updateProperties(note.id, { text: "scratch across the LNA input" });
    expect(t.shape(note.id)?.properties).toEqual({ text: "scratch across the LNA input" });
  });
});
