import { describe, it, expect } from "vitest";
import type { Position } from "../geometry/types";
import type { AnyShape } from "../markup/types";
import { NV24R_LAYOUT } from "../demo-die/layout";
import { dieSize, padDensity, padStateCounts, savedEstimateRows } from "./die-summary";
import { rectRing, shapeOf } from "./test-shapes";

const RECORDED = { widthUm: 2400, heightUm: 1600 };

describe("dieSize", () => {
  it("reads a rotated die outline along its own sides", () => {
    // A 2400 × 1600 rectangle turned 30° about the origin, corners rotated by hand with the
    // standard rotation matrix [[cos, −sin], [sin, cos]].
    const c = Math.cos(Math.PI / 6);
    const s = Math.sin(Math.PI / 6);
    const ring = rectRing(0, 0, 2400, 1600).map(([x, y]): Position => [c * x - s * y + 500, s * x + c * y + 500]);
    const size = dieSize([shapeOf("die_outline", { type: "Polygon", coordinates: [ring] })], { widthUm: null, heightUm: null });
    expect(size?.source).toBe("die_outline");
    expect(size?.widthUm).toBeCloseTo(2400, 6);
    expect(size?.heightUm).toBeCloseTo(1600, 6);
  });

  it("falls back to the bounding box of a non-rectangular outline, then to the recorded size", () => {
    const l: Position[] = [
      [0, 0],
      [2000, 0],
      [2000, 1000],
      [1000, 1000],
      [1000, 1500],
      [0, 1500],
      [0, 0],
    ];
    expect(dieSize([shapeOf("die_outline", { type: "Polygon", coordinates: [l] })], RECORDED)).toEqual({
      widthUm: 2000,
      heightUm: 1500,
      source: "outline_box",
    });
    expect(dieSize([], RECORDED)).toEqual({ widthUm: 2400, heightUm: 1600, source: "recorded" });
    expect(dieSize([], { widthUm: null, heightUm: 1600 })).toBeNull();
  });
});

describe("padDensity", () => {
  it("gives pads per mm of edge and per mm² for the demo die", () => {
    // NV-24R: 22 pads on 2.40 × 1.60 mm. By hand: perimeter 8.00 mm → 2.75 pads/mm;
    // area 3.84 mm² → 22/3.84 = 5.7292 pads/mm².
    const d = padDensity(22, 2400, 1600);
    expect(d.perimeterMm).toBeCloseTo(8, 12);
    expect(d.areaMm2).toBeCloseTo(3.84, 12);
    expect(d.padsPerMm).toBeCloseTo(2.75, 12);
    expect(d.padsPerMm2).toBeCloseTo(5.7292, 4);
  });
});

describe("padStateCounts", () => {
  const demoPads = () =>
    NV24R_LAYOUT.pads.map((p) => {
      const [x, y] = p.centreUm;
      return shapeOf("pad", { type: "Polygon", coordinates: [rectRing(x - 40, y - 40, x + 40, y + 40)] }, { label: p.label, net: p.net, state: p.state });
    });
  const bondsFor = (pads: AnyShape[]) =>
    NV24R_LAYOUT.wireBonds.map((b) =>
      shapeOf(
        "wire_bond",
        { type: "LineString", coordinates: [b.fromUm, b.toUm] },
        { diameterUm: 25, padId: pads.find((p) => p.properties.label === b.pad)!.id },
      ),
    );

  it("counts the demo die's pads by state, bonded ones from their wire bonds", () => {
    const pads = demoPads();
    // Counted by hand from the layout's pad lists: probed G5, VB1S, VB2S; open NC1; the other 18 bonded.
    expect(padStateCounts([...pads, ...bondsFor(pads)])).toEqual({ total: 22, bonded: 18, probed: 3, unbonded: 1 });
  });

  it("does not count a pad stored as bonded but carrying no wire bond as bonded", () => {
    // The fault seen: new pads were stored "bonded", so a die without a single bond read 18 bonded.
    const pads = demoPads();
    expect(padStateCounts(pads)).toEqual({ total: 22, bonded: 0, probed: 3, unbonded: 19 });
    // A state chosen by hand is kept whatever the bonds say.
    const byHand = pads.map((p) => ({ ...p, properties: { ...p.properties, stateByHand: true } }) as AnyShape);
    expect(padStateCounts(byHand)).toEqual({ total: 22, bonded: 18, probed: 3, unbonded: 1 });
  });
});

describe("savedEstimateRows", () => {
  it("lists every saved estimate with its shape", () => {
    const wb = shapeOf(
      "wire_bond",
      {
        type: "LineString",
        coordinates: [
          [0, 0],
          [1000, 0],
        ],
      },
      { label: "RFIN bond", diameterUm: 25, estimates: { "bond-wire": { inductanceNh: 0.865 } } },
    );
    const rows = savedEstimateRows([wb, shapeOf("note", { type: "Point", coordinates: [1, 1] }, { text: "x" })], (s) => String(s.properties.label ?? ""));
    expect(rows).toEqual([{ shapeId: wb.id, shapeKind: "wire_bond", label: "RFIN bond", key: "bond-wire", estimate: { inductanceNh: 0.865 } }]);
  });
});
