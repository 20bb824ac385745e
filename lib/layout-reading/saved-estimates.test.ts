import { describe, it, expect } from "vitest";
import { bondWireInductance, microstripAnalysis } from "../estimates";
import { newShapeSchema } from "../validation/markup";
import { summariseSavedEstimates, threeFigures, toSavedEstimate, withSavedEstimate } from "./saved-estimates";

const SAVED_AT = "2024-05-02T10:00:00.000Z";

describe("threeFigures", () => {
  it("rounds to three significant figures without an exponent", () => {
    // Rounding worked by hand.
    expect(threeFigures(1.0234)).toBe("1.02");
    expect(threeFigures(49.84)).toBe("49.8");
    expect(threeFigures(0.865035)).toBe("0.865");
    expect(threeFigures(18067.7)).toBe("18068");
    expect(threeFigures(0)).toBe("0");
  });
});

describe("toSavedEstimate", () => {
  it("keeps inputs, numbers, formula name and source, and passes the markup API's schema", () => {
    const inputs = { lengthUm: 1000, diameterUm: 25, count: 1, regime: "dc" as const, pitchUm: undefined };
    const record = toSavedEstimate("bond-wire", inputs, bondWireInductance(inputs), SAVED_AT);
    expect(record).toMatchObject({ kind: "bond-wire", lengthUm: 1000, diameterUm: 25, regime: "dc", savedAt: SAVED_AT });
    expect(record).not.toHaveProperty("pitchUm");
    // Rosa/Grover by hand for 1 mm of 25 µm wire: 0.86503 nH (see shape-inputs.test.ts).
    expect(record.inductanceNh as number).toBeCloseTo(0.86503, 4);
    expect(String(record.source)).toMatch(/Grover/);
    const shape = {
      kind: "wire_bond",
      geometry: {
        type: "LineString",
        coordinates: [
          [0, 0],
          [1000, 0],
        ],
      },
      properties: { diameterUm: 25, estimates: { "bond-wire": record } },
    };
    expect(newShapeSchema.safeParse(shape).success).toBe(true);
  });

  it("records warnings as one line", () => {
    const inputs = { lengthUm: 100, diameterUm: 25, count: 1, regime: "dc" as const };
    const record = toSavedEstimate("bond-wire", inputs, bondWireInductance(inputs), SAVED_AT);
    expect(String(record.warnings)).toMatch(/10 wire diameters/);
  });
});

describe("summariseSavedEstimates", () => {
  it("reads inductances and impedances in a few characters", () => {
    const bondIn = { lengthUm: 1000, diameterUm: 25, count: 1, regime: "dc" as const };
    // Pozar, Microwave Engineering, Example 3.7 geometry (εr 2.20, W/d 3.081): about 50 Ω.
    const msIn = { widthUm: 3081, heightUm: 1000, er: 2.2, thicknessUm: 0 };
    let estimates = withSavedEstimate({}, "bond-wire", toSavedEstimate("bond-wire", bondIn, bondWireInductance(bondIn), SAVED_AT));
    estimates = withSavedEstimate({ estimates }, "microstrip", toSavedEstimate("microstrip", msIn, microstripAnalysis(msIn), SAVED_AT));
    const line = summariseSavedEstimates({ estimates });
    expect(line).toMatch(/^L 0\.865 nH · Z0 (49\.\d|50\.\d) Ω \(microstrip\)$/);
  });

  it("ignores junk in properties.estimates", () => {
    expect(summariseSavedEstimates({ estimates: "nonsense" })).toBe("");
    expect(summariseSavedEstimates({ estimates: { a: 3, b: { note: "no numbers" } } })).toBe("");
  });
});
