import { describe, it, expect } from "vitest";
import { bondWireInductance } from "./bond-wire";
import { EstimateInputError } from "./input-error";

/**
 * Neumann's double integral for two parallel filaments of length l at distance d, evaluated
 * numerically (Simpson): M = µ0/4π ∬ dx dx′/√((x − x′)² + d²) = 2·10⁻⁷ ∫₀ˡ 2(l − u)/√(u² + d²) du.
 * This is the definition the closed forms are derived from, so it checks them independently.
 */
function neumannMutual(l: number, d: number): number {
  const n = 20000;
  const h = l / n;
  const f = (u: number) => (2 * (l - u)) / Math.sqrt(u * u + d * d);
  let s = f(0) + f(l);
  for (let i = 1; i < n; i++) s += f(i * h) * (i % 2 ? 4 : 2);
  return (1e-7 * (s * h)) / 3;
}

describe("bondWireInductance", () => {
  it("matches Neumann's integral at the geometric mean distance r·e^(−1/4) (dc)", () => {
    // Maxwell, Treatise on Electricity and Magnetism §692 (via Grover ch. 2): the self GMD of a
    // circular cross-section is r·e^(−1/4); L = M(GMD). Value of the GMD recalled from memory.
    const l = 1e-3;
    const r = 12.5e-6;
    const ref = neumannMutual(l, r * Math.exp(-0.25)) * 1e9;
    const ours = bondWireInductance({ lengthUm: 1000, diameterUm: 25 }).inductanceNh;
    // Rosa's form drops the + GMD/l term of the exact filament result: 0.2 % here (l/r = 80).
    expect(Math.abs(ours - ref) / ref).toBeLessThan(5e-3);
  });

  it("matches Neumann's integral at distance r when the current flows on the surface (hf)", () => {
    // GMD of a circle's circumference from itself is r (Maxwell; Grover ch. 2, from memory).
    const ref = neumannMutual(2e-3, 12.5e-6) * 1e9;
    const ours = bondWireInductance({ lengthUm: 2000, regime: "hf" }).inductanceNh;
    expect(Math.abs(ours - ref) / ref).toBeLessThan(5e-3);
  });

  it("gives about 1 nH per mm for 25 µm gold wire", () => {
    // Common practice: ~1 nH/mm for 25 µm bond wire (rule of thumb, no single source).
    for (const mm of [0.5, 1, 2, 3]) {
      const perMm = bondWireInductance({ lengthUm: mm * 1000 }).inductanceNh / mm;
      expect(perMm).toBeGreaterThan(0.7);
      expect(perMm).toBeLessThan(1.3);
    }
  });

  it("gives Grover's mutual inductance, checked against Neumann's integral", () => {
    // Grover 1946, mutual inductance of equal parallel filaments; reference by numerical integration.
    const est = bondWireInductance({ lengthUm: 1000, count: 2, pitchUm: 100 });
    const ref = neumannMutual(1e-3, 100e-6) * 1e9;
    expect(Math.abs((est.mutualNh as number) - ref) / ref).toBeLessThan(1e-4);
    // Grover: two bonds in parallel give (L + M)/2, so doubling does not halve the inductance.
    expect(est.inductanceNh).toBeCloseTo((est.selfInductanceNh + (est.mutualNh as number)) / 2, 12);
    expect(est.inductiveSplitNh).toBeCloseTo(est.inductanceNh, 12);
    expect(est.inductanceNh).toBeGreaterThan(est.selfInductanceNh / 2);
  });

  it("rises with length", () => {
    let previous = 0;
    for (const lengthUm of [200, 500, 1000, 2000, 4000]) {
      const l = bondWireInductance({ lengthUm }).inductanceNh;
      expect(l).toBeGreaterThan(previous);
      previous = l;
    }
  });

  it("falls with more bonds in parallel but never below L/n", () => {
    const single = bondWireInductance({ lengthUm: 1000 }).inductanceNh;
    let previous = single;
    for (let count = 2; count <= 8; count++) {
      const est = bondWireInductance({ lengthUm: 1000, count, pitchUm: 60 });
      expect(est.inductanceNh).toBeLessThan(previous);
      expect(est.inductanceNh).toBeGreaterThan(single / count);
      expect(est.inductiveSplitNh as number).toBeLessThanOrEqual(est.inductanceNh + 1e-12);
      expect(est.inductiveSplitNh as number).toBeGreaterThan(single / count);
      previous = est.inductanceNh;
    }
  });

  it("is lower at high frequency than at dc", () => {
    const dc = bondWireInductance({ lengthUm: 1000 }).inductanceNh;
    const hf = bondWireInductance({ lengthUm: 1000, regime: "hf" }).inductanceNh;
    // The difference is exactly 2e-7·l·0.25 H = 0.05 nH for 1 mm (difference of the constants).
    expect(dc - hf).toBeCloseTo(0.05, 12);
  });

  it("warns when the wire is not much longer than its radius", () => {
    expect(bondWireInductance({ lengthUm: 100 }).warnings).toHaveLength(1);
    expect(bondWireInductance({ lengthUm: 1000 }).warnings).toHaveLength(0);
  });

  it("rejects bad input by parameter name", () => {
    const cases: [Parameters<typeof bondWireInductance>[0], string][] = [
      [{ lengthUm: 0 }, "lengthUm"],
      [{ lengthUm: Number.NaN }, "lengthUm"],
      [{ lengthUm: 1000, diameterUm: -25 }, "diameterUm"],
      [{ lengthUm: 1000, count: 2 }, "pitchUm"],
      [{ lengthUm: 1000, count: 2, pitchUm: 20 }, "pitchUm"],
      [{ lengthUm: 1000, count: 1.5, pitchUm: 100 }, "count"],
    ];
    for (const [input, name] of cases) {
      expect(() => bondWireInductance(input)).toThrow(EstimateInputError);
      try {
        bondWireInductance(input);
      } catch (e) {
        expect((e as EstimateInputError).parameter).toBe(name);
      }
    }
  });
});
