import { describe, it, expect } from "vitest";
import { SUBSTRATE_PRESETS, substratePreset } from "./substrates";

describe("SUBSTRATE_PRESETS", () => {
  it("carries the usual permittivities", () => {
    // Common practice (REFERENCES.md [practice]): Si 11.7–11.9, GaAs 12.9, InP 12.4, SiC 9.7–10,
    // sapphire 9.4–11.6, alumina 9.8, AlN 8.8, fused silica 3.8.
    const expected: Record<string, number> = {
      si: 11.9,
      "sige-on-si": 11.9,
      gaas: 12.9,
      inp: 12.4,
      sic: 9.7,
      sapphire: 9.4,
      alumina: 9.8,
      aln: 8.8,
      "fused-silica": 3.8,
    };
    for (const [id, er] of Object.entries(expected)) expect(substratePreset(id)?.er).toBe(er);
    expect(SUBSTRATE_PRESETS).toHaveLength(Object.keys(expected).length);
  });

  it("keeps each default inside its range and marks every value as common practice", () => {
    for (const p of SUBSTRATE_PRESETS) {
      expect(p.er).toBeGreaterThanOrEqual(p.erRange[0]);
      expect(p.er).toBeLessThanOrEqual(p.erRange[1]);
      expect(p.basis).toBe("common practice");
    }
  });
});
