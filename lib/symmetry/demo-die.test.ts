import { describe, it, expect } from "vitest";
import type { Geometry, LineStringGeometry, Position } from "../geometry/types";
import { NV24R_LAYOUT } from "../demo-die/layout";
import { symmetryReport } from "./report";
import type { SymmetryShape } from "./types";

/**
 * The demo die's ground truth (lib/demo-die/layout.ts, the layout the demo micrographs are
 * rendered from) is mirror-symmetric about y = 800 µm except for its text marks. The expected
 * partner of each shape is found here by hand, (x, y) → (x, 1600 − y), not by the code under test.
 */
const AXIS: LineStringGeometry = {
  type: "LineString",
  coordinates: [
    [0, 800],
    [2400, 800],
  ],
};

function padShapes(): (SymmetryShape & { label: string; centre: Position })[] {
  return NV24R_LAYOUT.pads.map((p) => {
    const [x, y] = p.centreUm;
    const [w, h] = p.sizeUm;
    const ring: Position[] = [
      [x - w / 2, y - h / 2],
      [x + w / 2, y - h / 2],
      [x + w / 2, y + h / 2],
      [x - w / 2, y + h / 2],
      [x - w / 2, y - h / 2],
    ];
    return { id: p.label, kind: "pad", geometry: { type: "Polygon", coordinates: [ring] }, label: p.label, centre: p.centreUm };
  });
}

function otherShapes(): SymmetryShape[] {
  const blocks = NV24R_LAYOUT.blocks.map((b): SymmetryShape => ({
    id: b.name,
    kind: "block",
    geometry: { type: "Polygon", coordinates: [b.polygonUm.map((p) => [p[0], p[1]])] },
  }));
  const line = (name: string, pts: readonly Position[]): SymmetryShape => ({
    id: name,
    kind: "trace",
    geometry: { type: "LineString", coordinates: pts.map((p) => [p[0], p[1]]) } as Geometry,
  });
  return [...blocks, ...NV24R_LAYOUT.meanders.map((t) => line(t.name, t.pointsUm)), ...NV24R_LAYOUT.routes.map((t) => line(t.name, t.pointsUm))];
}

describe("symmetry of the demo die's ground truth", () => {
  it("pairs every pad with its mirror partner at zero deviation", () => {
    const pads = padShapes();
    const report = symmetryReport(pads, AXIS);
    expect(report.unmatched).toEqual([]);
    for (const pad of pads) {
      const [x, y] = pad.centre;
      const partner = pads.find((q) => q.centre[0] === x && q.centre[1] === 1600 - y)!;
      const pair = report.pairs.find((p) => p.aId === pad.id || p.bId === pad.id)!;
      expect(pair, pad.label).toBeDefined();
      expect([pair.aId, pair.bId].sort(), pad.label).toEqual([pad.id, partner.id].sort());
      expect(pair.deviationUm).toBeLessThan(1e-9);
    }
    // 22 pads: G2 and G5 sit on the axis and are their own mirror images; 10 pairs besides.
    expect(report.pairs).toHaveLength(12);
    expect(
      report.pairs
        .filter((p) => p.selfPaired)
        .map((p) => p.aId)
        .sort(),
    ).toEqual(["G2", "G5"]);
  });

  it("pairs the blocks, peaking lines and routes at zero deviation too", () => {
    const report = symmetryReport([...padShapes(), ...otherShapes()], AXIS);
    expect(report.unmatched).toEqual([]);
    expect(report.summary.maxDeviationUm).toBeLessThan(1e-9);
    const pairOf = (id: string) => report.pairs.find((p) => p.aId === id || p.bId === id)!;
    expect([pairOf("LNA core P").aId, pairOf("LNA core P").bId].sort()).toEqual(["LNA core N", "LNA core P"]);
    expect(pairOf("Mixer").selfPaired).toBe(true);
    expect([pairOf("Peaking line P").aId, pairOf("Peaking line P").bId].sort()).toEqual(["Peaking line N", "Peaking line P"]);
  });
});
