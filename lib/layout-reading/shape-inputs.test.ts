import { describe, it, expect } from "vitest";
import { bondWireInductance, spiralInductance, stripInductance } from "../estimates";
import type { AnyShape } from "../markup/types";
import { estimateRoleOf, spiralOuterDiameterFromBlock, traceInputs, wireBondInputs } from "./shape-inputs";
import { rectRing, shapeOf } from "./test-shapes";

const bond = (coords: [number, number][], props: Record<string, unknown> = {}) =>
  shapeOf("wire_bond", { type: "LineString", coordinates: coords }, props) as AnyShape & { kind: "wire_bond" };

describe("wireBondInputs", () => {
  it("takes the drawn length and the recorded diameter", () => {
    // A 600 × 800 µm run is 1000 µm long (3-4-5 right triangle).
    expect(
      wireBondInputs(
        bond(
          [
            [100, 100],
            [700, 900],
          ],
          { diameterUm: 32 },
        ),
      ),
    ).toEqual({ lengthUm: 1000, diameterUm: 32 });
  });

  it("falls back to 25 µm wire when no diameter is recorded", () => {
    // 25 µm (1 mil) gold wire is the usual ball-bond wire [practice].
    expect(
      wireBondInputs(
        bond([
          [0, 0],
          [0, 500],
        ]),
      ).diameterUm,
    ).toBe(25);
  });

  it("feeds the Rosa/Grover round-wire formula", () => {
    const { lengthUm, diameterUm } = wireBondInputs(
      bond([
        [0, 0],
        [600, 800],
      ]),
    );
    // Rosa 1908; Grover, Inductance Calculations, 1946: L = 2e-7·l·[ln(2l/r) − 0.75] H.
    // By hand: l = 1e-3 m, r = 12.5e-6 m, ln(160) = 5.07517 → 2e-10 × 4.32517 = 0.86503 nH.
    expect(bondWireInductance({ lengthUm, diameterUm }).inductanceNh).toBeCloseTo(0.86503, 4);
    // The trade's rule of thumb is about 1 nH per mm of 25 µm wire [practice].
    expect(bondWireInductance({ lengthUm, diameterUm }).inductanceNh).toBeGreaterThan(0.7);
  });
});

describe("traceInputs", () => {
  it("counts every segment of a meander and keeps the trace width", () => {
    const trace = shapeOf(
      "trace",
      {
        type: "LineString",
        coordinates: [
          [0, 0],
          [100, 0],
          [100, 50],
          [200, 50],
        ],
      },
      { widthUm: 6 },
    ) as AnyShape & { kind: "trace" };
    // 100 + 50 + 100 µm, summed by hand.
    expect(traceInputs(trace)).toEqual({ lengthUm: 250, widthUm: 6 });
  });

  it("feeds Grover's straight-bar formula", () => {
    const trace = shapeOf(
      "trace",
      {
        type: "LineString",
        coordinates: [
          [0, 0],
          [1000, 0],
        ],
      },
      { widthUm: 9 },
    ) as AnyShape & { kind: "trace" };
    const { lengthUm, widthUm } = traceInputs(trace);
    // Grover 1946 / Terman 1943: L = 2e-7·l·[ln(2l/(w+t)) + 0.5 + 0.2235·(w+t)/l]; l = 1 mm,
    // w + t = 10 µm: ln(200) = 5.29832, + 0.5 + 0.002235 → 2e-10 × 5.80055 = 1.16011 nH, by hand.
    expect(stripInductance({ lengthUm, widthUm, thicknessUm: 1 }).inductanceNh).toBeCloseTo(1.16011, 4);
  });
});

describe("spiralOuterDiameterFromBlock", () => {
  it("takes the shorter side of the block's bounding box", () => {
    const block = shapeOf("block", { type: "Polygon", coordinates: [rectRing(260, 700, 460, 960)] }, { name: "L1", function: "" }) as AnyShape & {
      kind: "block";
    };
    expect(spiralOuterDiameterFromBlock(block)).toBe(200);
  });

  it("feeds the modified Wheeler formula with the block's size", () => {
    const block = shapeOf("block", { type: "Polygon", coordinates: [rectRing(0, 0, 200, 200)] }) as AnyShape & { kind: "block" };
    const d = spiralOuterDiameterFromBlock(block);
    // Mohan et al., IEEE JSSC 34(10), 1999, modified Wheeler, square K1 2.34, K2 2.75. By hand for
    // n 3, d_out 200, w 12, s 6 µm: d_in = 200 − 2·3·12 − 2·2·6 = 104, d_avg 152, ρ = 96/304 = 0.315789;
    // L = 2.34 × 4πe-7 × 9 × 152e-6 / (1 + 2.75 × 0.315789) = 4.02262e-9 / 1.868421 = 2.15294 nH.
    const L = spiralInductance({ shape: "square", turns: 3, outerDiameterUm: d, widthUm: 12, spacingUm: 6, method: "wheeler" }).inductanceNh;
    expect(L).toBeCloseTo(2.15294, 3);
  });
});

describe("estimateRoleOf", () => {
  it("offers estimates for wire bonds, traces and blocks only", () => {
    expect(
      estimateRoleOf(
        bond([
          [0, 0],
          [1, 1],
        ]),
      ),
    ).toBe("wire-bond");
    expect(estimateRoleOf(shapeOf("note", { type: "Point", coordinates: [0, 0] }, { text: "x" }))).toBeNull();
  });
});
