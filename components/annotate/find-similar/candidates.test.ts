import { describe, expect, it } from "vitest";
import type { SimilarCandidateDto } from "@/lib/dto/find-similar";
import type { AnyShape } from "@/lib/markup/types";
import { padShape } from "../editor/editor-test-kit";
import { rectangleGeometry } from "../editor/rectangle";
import { candidateAt, draftsFor, shownCandidates } from "./candidates";

// Boxes and names worked out by hand.
const cand = (x: number, y: number, score: number, w = 80, h = 80): SimilarCandidateDto => ({
  box: { x: 0, y: 0, w: 1, h: 1 },
  boxUm: { x, y, w, h },
  centreUm: [x + w / 2, y + h / 2],
  score,
  rotation: 0,
  mirrored: false,
});

describe("reviewing found candidates", () => {
  const all = [cand(0, 0, 0.95), cand(100, 0, 0.72), cand(200, 0, 0.6)];

  it("shows those at or above the threshold, keeping their index in the answer", () => {
    expect(shownCandidates(all, 0.7).map((s) => s.i)).toEqual([0, 1]);
    expect(shownCandidates(all, 0.72).map((s) => s.i)).toEqual([0, 1]);
    expect(shownCandidates(all, 0.96)).toEqual([]);
  });

  it("finds the candidate under a point, the smaller one where two overlap, none between them", () => {
    const shown = shownCandidates([cand(0, 0, 0.9, 200, 200), cand(50, 50, 0.8, 20, 20)], 0.5);
    expect(candidateAt(shown, [60, 60])).toBe(1);
    expect(candidateAt(shown, [10, 10])).toBe(0);
    expect(candidateAt(shown, [300, 10])).toBeNull();
  });

  it("makes unbonded, unlabelled pads of the candidates' die boxes", () => {
    const template = padShape("p1", 110, 1530);
    const drafts = draftsFor([cand(370, 1490, 0.9)], template, [template]);
    expect(drafts).toEqual([
      { kind: "pad", geometry: rectangleGeometry({ minX: 370, minY: 1490, maxX: 450, maxY: 1570 }), properties: { label: "", net: "", state: "unbonded" } },
    ]);
  });

  it("names new blocks after the free names and copies the template's function", () => {
    const block = (id: string, name: string): AnyShape =>
      ({
        id,
        kind: "block",
        geometry: rectangleGeometry({ minX: 0, minY: 0, maxX: 10, maxY: 10 }),
        properties: { name, function: "decoupling capacitor" },
        version: 1,
        createdBy: null,
        updatedAt: "",
      }) as AnyShape;
    const template = block("b1", "Block 1");
    const drafts = draftsFor([cand(0, 0, 0.9), cand(100, 0, 0.8)], template, [template, block("b3", "Block 3")]);
    expect(drafts.map((d) => d.properties)).toEqual([
      { name: "Block 2", function: "decoupling capacitor" },
      { name: "Block 4", function: "decoupling capacitor" },
    ]);
  });
});
