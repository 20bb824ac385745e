import { describe, it, expect } from "vitest";
import type { Geometry, LineStringGeometry, PolygonGeometry, Position } from "../geometry/types";
import { symmetryReport } from "./report";
import { SymmetryInputError, type SymmetryShape } from "./types";

/**
 * Synthetic layout after the demo scenario: the NV-24R receiver die, 2400 × 1600 µm,
 * mirror-symmetric about the horizontal axis y = 800. Mirror images in these tests are built by
 * hand, (x, y) → (x, 1600 − y), not with the code under test.
 */
const AXIS: LineStringGeometry = {
  type: "LineString",
  coordinates: [
    [0, 800],
    [2400, 800],
  ],
};

function rect(x0: number, y0: number, x1: number, y1: number): PolygonGeometry {
  return {
    type: "Polygon",
    coordinates: [
      [
        [x0, y0],
        [x1, y0],
        [x1, y1],
        [x0, y1],
        [x0, y0],
      ],
    ],
  };
}
const flipY = (g: Geometry): Geometry => {
  const f = (p: Position): Position => [p[0], 1600 - p[1]];
  if (g.type === "Point") return { type: "Point", coordinates: f(g.coordinates) };
  if (g.type === "LineString") return { type: "LineString", coordinates: g.coordinates.map(f) };
  return { type: "Polygon", coordinates: g.coordinates.map((r) => r.map(f).reverse()) };
};

function layout(): SymmetryShape[] {
  const shapes: SymmetryShape[] = [];
  for (let i = 0; i < 9; i++) {
    const x = 200 + i * 220;
    const top = rect(x, 1480, x + 80, 1560);
    shapes.push({ id: `pad-top-${i}`, kind: "pad", geometry: top });
    shapes.push({ id: `pad-bottom-${i}`, kind: "pad", geometry: flipY(top) });
  }
  shapes.push({ id: "lna", kind: "block", geometry: rect(300, 600, 800, 1000) });
  shapes.push({ id: "if-buffer", kind: "block", geometry: rect(1700, 650, 2100, 950) });
  shapes.push({ id: "mixer-p", kind: "block", geometry: rect(900, 830, 1500, 1200) });
  shapes.push({ id: "mixer-n", kind: "block", geometry: flipY(rect(900, 830, 1500, 1200)) });
  const meander: LineStringGeometry = {
    type: "LineString",
    coordinates: [
      [950, 1250],
      [1000, 1250],
      [1000, 1300],
      [1050, 1300],
      [1050, 1250],
    ],
  };
  shapes.push({ id: "peaking-p", kind: "trace", geometry: meander });
  shapes.push({ id: "peaking-n", kind: "trace", geometry: flipY(meander) });
  shapes.push({ id: "note-1", kind: "note", geometry: { type: "Point", coordinates: [50, 1590] } });
  shapes.push({
    id: "ruler-1",
    kind: "ruler",
    geometry: {
      type: "LineString",
      coordinates: [
        [0, 0],
        [2400, 0],
      ],
    },
  });
  return shapes;
}

const replace = (shapes: SymmetryShape[], id: string, geometry: Geometry) => shapes.map((s) => (s.id === id ? { ...s, geometry } : s));
const pairOf = (report: ReturnType<typeof symmetryReport>, id: string) => report.pairs.find((p) => p.aId === id || p.bId === id)!;

describe("symmetryReport", () => {
  it("reports zero deviation for a mirrored layout", () => {
    const report = symmetryReport(layout(), AXIS);
    expect(report.unmatched).toEqual([]);
    expect(report.pairs).toHaveLength(9 + 2 + 1 + 1); // pads, two self-paired blocks, the mixer halves, the peaking lines
    for (const p of report.pairs) {
      expect(p.deviationUm).toBeLessThan(1e-9);
      expect(p.withinTolerance).toBe(true);
    }
    expect(pairOf(report, "pad-top-4").bId).toBe("pad-bottom-4");
    expect(pairOf(report, "lna").selfPaired).toBe(true);
    expect(pairOf(report, "mixer-p").bId).toBe("mixer-n");
    expect(report.pairs.some((p) => p.aId === "note-1" || p.aId === "ruler-1")).toBe(false);
  });

  it("reports a pad moved 3 µm in x at exactly 3 µm", () => {
    const shapes = replace(layout(), "pad-bottom-2", flipY(rect(643, 1480, 723, 1560)));
    const pair = pairOf(symmetryReport(shapes, AXIS, { toleranceUm: 1 }), "pad-bottom-2");
    expect(pair.aId).toBe("pad-top-2");
    // A is the top pad (left of the axis direction); the bottom one moved +3 µm, so A − mirror(B) = (−3, 0).
    expect(pair.offsetUm.x).toBeCloseTo(-3, 9);
    expect(pair.offsetUm.y).toBeCloseTo(0, 9);
    expect(pair.deviationUm).toBeCloseTo(3, 9);
    expect(pair.withinTolerance).toBe(false);
  });

  it("reports size differences of pads and lengths of traces", () => {
    let shapes = replace(layout(), "pad-bottom-0", flipY(rect(199, 1480, 281, 1560)));
    const longer: LineStringGeometry = {
      type: "LineString",
      coordinates: [
        [950, 1250],
        [1000, 1250],
        [1000, 1300],
        [1050, 1300],
        [1050, 1245],
      ],
    };
    shapes = replace(shapes, "peaking-n", flipY(longer));
    const report = symmetryReport(shapes, AXIS, { toleranceUm: 1 });
    const pad = pairOf(report, "pad-bottom-0");
    expect(pad.deviationUm).toBeLessThan(1e-9);
    expect(pad.sizeDifferenceUm).toEqual({ widthUm: -2, heightUm: 0 });
    expect(pad.withinTolerance).toBe(false);
    const trace = pairOf(report, "peaking-n");
    expect("lengthUm" in trace.sizeDifferenceUm && trace.sizeDifferenceUm.lengthUm).toBeCloseTo(-5, 9);
  });

  it("pairs a block on the axis with itself and reports twice its distance from the axis", () => {
    const shapes = replace(layout(), "lna", rect(300, 602, 800, 1002));
    const pair = pairOf(symmetryReport(shapes, AXIS), "lna");
    expect(pair.selfPaired).toBe(true);
    expect(pair.offsetUm.y).toBeCloseTo(4, 9);
  });

  it("counts shapes on the axis apart from the pairs, and leaves them out of the pair offsets", () => {
    // By hand: 9 pad pairs, the mixer halves and the peaking lines are pairs of two shapes (11);
    // the LNA and IF buffer straddle y = 800 and are their own mirror images (2 on the axis).
    // The LNA moved up 4 µm is 8 µm from its mirror image, which must not become the largest pair offset.
    const shapes = replace(layout(), "lna", rect(300, 604, 800, 1004));
    const { summary } = symmetryReport(shapes, AXIS, { toleranceUm: 1 });
    expect(summary.pairCount).toBe(11);
    expect(summary.withinToleranceCount).toBe(11);
    expect(summary.onAxisCount).toBe(2);
    expect(summary.onAxisWithinToleranceCount).toBe(1);
    expect(summary.maxDeviationUm).toBeLessThan(1e-9);
    expect(summary.totalDeviationUm).toBeCloseTo(8, 9);
  });

  it("leaves shapes unmatched beyond the cut-off and without a partner", () => {
    let shapes = replace(layout(), "pad-bottom-8", flipY(rect(1960 + 60, 1480, 2040 + 60, 1560)));
    shapes = [...shapes, { id: "pad-extra", kind: "pad", geometry: rect(2250, 1300, 2330, 1380) }];
    const report = symmetryReport(shapes, AXIS, { maxDistanceUm: 50 });
    const ids = report.unmatched.map((u) => u.id).sort();
    expect(ids).toEqual(["pad-bottom-8", "pad-extra", "pad-top-8"]);
    const wide = symmetryReport(shapes, AXIS, { maxDistanceUm: 100 });
    expect(pairOf(wide, "pad-top-8").deviationUm).toBeCloseTo(60, 9);
  });

  it("never pairs shapes of different kinds", () => {
    const shapes: SymmetryShape[] = [
      { id: "p", kind: "pad", geometry: rect(0, 900, 10, 910) },
      { id: "b", kind: "block", geometry: rect(0, 690, 10, 700) },
    ];
    expect(symmetryReport(shapes, AXIS).unmatched).toHaveLength(2);
  });

  it("works across a slanted axis", () => {
    // Axis through the origin at 30°: reflection matrix [[cos 60°, sin 60°], [sin 60°, −cos 60°]]
    // (standard reflection across a line at angle θ), applied here by hand.
    const c = 0.5;
    const s = Math.sqrt(3) / 2;
    const m = (p: Position): Position => [c * p[0] + s * p[1], s * p[0] - c * p[1]];
    const tri: PolygonGeometry = {
      type: "Polygon",
      coordinates: [
        [
          [0, 100],
          [40, 110],
          [10, 150],
          [0, 100],
        ],
      ],
    };
    const image: PolygonGeometry = { type: "Polygon", coordinates: [tri.coordinates[0].map(m).reverse()] };
    const axis: LineStringGeometry = {
      type: "LineString",
      coordinates: [
        [0, 0],
        [2 * Math.sqrt(3), 2],
      ],
    };
    const report = symmetryReport(
      [
        { id: "t", kind: "block", geometry: tri },
        { id: "u", kind: "block", geometry: image },
      ],
      axis,
    );
    expect(report.pairs).toHaveLength(1);
    expect(report.pairs[0].deviationUm).toBeLessThan(1e-9);
  });

  it("rejects bad options", () => {
    expect(() => symmetryReport([], AXIS, { maxDistanceUm: 0 })).toThrow(SymmetryInputError);
    expect(() => symmetryReport([], AXIS, { toleranceUm: -1 })).toThrow(SymmetryInputError);
  });
});
