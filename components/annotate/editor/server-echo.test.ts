import { describe, expect, it } from "vitest";
import { padShape, setup } from "./editor-test-kit";
import type { AnyShape } from "@/lib/markup/types";

// Ground truth built by the test: what each request sent, and what the user did after it.
const p7 = padShape("p7", 60, 800, 80, { label: "P7" });

describe("server answers to requests sent before a newer edit", () => {
  it("take only the version (and author) when the shape was edited after the request", () => {
    const t = setup({ shapes: [p7] });
    t.editor.updateProperties("p7", { label: "VCC" });
    const sent = t.shape("p7")!;
    t.editor.updateProperties("p7", { net: "VCC" });
    t.editor.applyServerShape({ ...sent, version: 2, createdBy: "reviewer" }, sent);
    expect(t.shape("p7")).toEqual({ ...sent, version: 2, createdBy: "reviewer", properties: { ...sent.properties, net: "VCC" } });
    expect(t.commits).toHaveLength(2);
  });

  it("are taken whole when the shape still holds what was sent", () => {
    const t = setup({ shapes: [p7] });
    t.editor.updateProperties("p7", { label: "VCC" });
    const sent = t.shape("p7")!;
    // The server may tidy what it stores; with no newer edit its answer is the truth.
    const answer = { ...sent, version: 2, properties: { ...sent.properties, net: "VCC" } } as AnyShape;
    t.editor.applyServerShape(answer, sent);
    expect(t.shape("p7")).toEqual(answer);
  });

  it("keep a newer edit in a drag's starting point, so cancelling the drag does not drop it", () => {
    const t = setup({ shapes: [p7] });
    const sent = { ...p7 };
    t.editor.updateProperties("p7", { label: "VCC" });
    const edited = t.shape("p7")!;
    t.down(60, 800);
    t.move(60, 900);
    t.editor.applyServerShape({ ...sent, version: 2 }, sent);
    t.editor.cancel();
    expect(t.shape("p7")).toEqual({ ...edited, version: 2 });
  });

  it("do not bring back a shape removed after its request was sent", () => {
    const t = setup();
    t.editor.setTool("pad");
    t.click(300, 300);
    const sent = t.ofKind("pad")[0];
    t.editor.deleteSelection();
    t.editor.applyServerShape({ ...sent, version: 1 }, sent);
    expect(t.ofKind("pad")).toEqual([]);
  });
});
