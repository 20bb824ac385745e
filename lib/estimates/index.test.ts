import { describe, it, expect } from "vitest";
import { estimate, EstimateInputError, ESTIMATE_KINDS } from "./index";

/** Calls estimate and returns the parameter named by the thrown EstimateInputError. */
function badParameter(kind: string, params: Record<string, string | undefined>): string {
  try {
    estimate(kind, params);
  } catch (e) {
    if (e instanceof EstimateInputError) return e.parameter;
    throw e;
  }
  throw new Error("expected an EstimateInputError");
}

describe("estimate", () => {
  it("parses strings and applies the documented defaults", () => {
    const wire = estimate("bond-wire", { lengthUm: "1000" });
    // 25 µm default diameter, dc: 2e-7·1e-3·[ln(2000/12.5) − 0.75] H (Rosa; Grover), worked by hand
    expect((wire as { inductanceNh: number }).inductanceNh).toBeCloseTo(0.2 * (Math.log(160) - 0.75), 12);
    const optics = estimate("optics", { numericalAperture: "0.5", cameraPixelPitchUm: "5", objectiveMag: "20" }) as { rayleighUm: number };
    // Rayleigh with the 550 nm default: 0.61·0.55/0.5 µm
    expect(optics.rayleighUm).toBeCloseTo((0.61 * 0.55) / 0.5, 12);
  });

  it("reaches every kind", () => {
    const params: Record<string, Record<string, string>> = {
      "bond-wire": { lengthUm: "800", count: "3", pitchUm: "70", regime: "hf" },
      strip: { lengthUm: "500", widthUm: "10", thicknessUm: "2" },
      spiral: { shape: "octagonal", turns: "3", outerDiameterUm: "200", widthUm: "10", spacingUm: "3", method: "wheeler" },
      microstrip: { widthUm: "70", heightUm: "100", er: "12.9" },
      cpw: { widthUm: "40", gapUm: "20", er: "11.9", heightUm: "200", backed: "true" },
      optics: { numericalAperture: "0.8", cameraPixelPitchUm: "5", objectiveMag: "50" },
      wafer: { waferDiameterMm: "200", dieWidthMm: "2.4", dieHeightMm: "1.6", defectDensityPerCm2: "0.1", model: "murphy" },
    };
    for (const kind of ESTIMATE_KINDS) {
      const result = estimate(kind, params[kind]);
      expect(typeof result.formula).toBe("string");
      expect(result.source.length).toBeGreaterThan(0);
      expect(Array.isArray(result.warnings)).toBe(true);
    }
  });

  it("synthesises a microstrip width when only z0Ohm is given", () => {
    // Pozar, Microwave Engineering, 4th ed., Example 3.7: 50 Ω on 0.127 cm, εr 2.20 → W ≈ 0.391 cm
    const result = estimate("microstrip", { z0Ohm: "50", heightUm: "1270", er: "2.2" }) as { widthUm: number };
    expect(Math.abs(result.widthUm - 3910) / 3910).toBeLessThan(0.01);
  });

  it("names the missing or malformed parameter", () => {
    expect(badParameter("bond-wire", {})).toBe("lengthUm");
    expect(badParameter("bond-wire", { lengthUm: "12abc" })).toBe("lengthUm");
    expect(badParameter("bond-wire", { lengthUm: "-3" })).toBe("lengthUm");
    expect(badParameter("bond-wire", { lengthUm: "Infinity" })).toBe("lengthUm");
    expect(badParameter("bond-wire", { lengthUm: "1000", regime: "ac" })).toBe("regime");
    expect(badParameter("cpw", { widthUm: "40", gapUm: "20", er: "4", backed: "maybe" })).toBe("backed");
    expect(badParameter("microstrip", { heightUm: "100", er: "4" })).toBe("widthUm");
    expect(badParameter("microstrip", { widthUm: "10", z0Ohm: "50", heightUm: "100", er: "4" })).toBe("z0Ohm");
    expect(badParameter("spiral", { turns: "3" })).toBe("shape");
    expect(badParameter("teleport", {})).toBe("kind");
  });

  it("says what a positive number is in the message", () => {
    expect(() => estimate("bond-wire", { lengthUm: "" })).toThrow("lengthUm must be a positive number");
  });

  it("accepts a zero thickness and a zero defect density", () => {
    expect(() => estimate("microstrip", { widthUm: "70", heightUm: "100", er: "12.9", thicknessUm: "0" })).not.toThrow();
    const wafer = estimate("wafer", { waferDiameterMm: "150", dieWidthMm: "2", dieHeightMm: "2", defectDensityPerCm2: "0" }) as { yield: number };
    expect(wafer.yield).toBe(1);
  });
});
