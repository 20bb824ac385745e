import { describe, it, expect } from "vitest";
import ellipk from "@stdlib/math-base-special-ellipk";
import { agm, ellipticK, ellipticKRatio } from "./elliptic";

describe("ellipticK", () => {
  it("matches Abramowitz & Stegun at m = 0.5", () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions, Table 17.1: K(m = 0.5)
    expect(ellipticK(0.5)).toBeCloseTo(1.8540746773013719, 14);
  });

  it("equals π/2 at m = 0", () => {
    // DLMF §19.6.1: K(0) = π/2
    expect(ellipticK(0)).toBeCloseTo(Math.PI / 2, 15);
  });

  it("agrees with @stdlib ellipk (parameter m = k²) over a sweep", () => {
    // Independent reference library: @stdlib/math-base-special-ellipk takes the parameter m.
    const ms = [-5, -1, -0.3, 0, 1e-9, 0.01, 0.1, 0.25, 0.5, 0.7, 0.9, 0.99, 0.999, 0.999999, 1 - 1e-12];
    for (let i = 0; i <= 50; i++) ms.push(i / 51);
    for (const m of ms) {
      const ours = ellipticK(m);
      const ref = ellipk(m);
      expect(Math.abs(ours - ref) / ref).toBeLessThan(1e-13);
    }
  });

  it("diverges at m = 1 and rejects m > 1", () => {
    expect(ellipticK(1)).toBe(Infinity);
    expect(() => ellipticK(1.5)).toThrow(RangeError);
  });
});

describe("ellipticKRatio", () => {
  it("takes the modulus k, not the parameter m, checked against @stdlib", () => {
    // @stdlib ellipk(m) with m = k² and m' = 1 − k²
    for (const k of [0.01, 0.2, 0.4, 0.5, 2 / 3, 0.8, 0.95, 0.999]) {
      const ref = ellipk(k * k) / ellipk(1 - k * k);
      expect(Math.abs(ellipticKRatio(k) - ref) / ref).toBeLessThan(1e-12);
    }
  });

  it("is 1 at k = 1/√2, where k = k′", () => {
    // DLMF §19.6.1: K(1/√2) = K′(1/√2), the self-complementary modulus
    expect(ellipticKRatio(Math.SQRT1_2)).toBeCloseTo(1, 14);
  });

  it("uses a supplied complementary modulus when k is close to 1", () => {
    const kp = 1e-9;
    const k = Math.sqrt(1 - kp * kp);
    // Asymptotic form K(k) ≈ ln(4/k′) for k′ → 0 (DLMF §19.12.1), K(k′) → π/2
    expect(ellipticKRatio(k, kp)).toBeCloseTo(Math.log(4 / kp) / (Math.PI / 2), 9);
  });
});

describe("agm", () => {
  it("matches Gauss's constant for AGM(1, √2)", () => {
    // Gauss's constant G = 1/AGM(1, √2) = 0.8346268416740731 (DLMF §19.8; value from memory)
    expect(agm(1, Math.SQRT2)).toBeCloseTo(1.1981402347355922, 14);
  });
});
