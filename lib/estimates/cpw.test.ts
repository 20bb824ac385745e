import { describe, it, expect } from "vitest";
import { cpwImpedance } from "./cpw";
import { EstimateInputError } from "./input-error";

/** Minimal complex arithmetic for reading two-port data in the tests. */
type Cx = readonly [number, number];
const add = (a: Cx, b: Cx): Cx => [a[0] + b[0], a[1] + b[1]];
const sub = (a: Cx, b: Cx): Cx => [a[0] - b[0], a[1] - b[1]];
const mul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: Cx, b: Cx): Cx => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const sqrt = (a: Cx): Cx => {
  const r = Math.hypot(a[0], a[1]);
  return [Math.sqrt((r + a[0]) / 2), Math.sign(a[1] || 1) * Math.sqrt((r - a[0]) / 2)];
};
const log = (a: Cx): Cx => [Math.log(Math.hypot(a[0], a[1])), Math.atan2(a[1], a[0])];
const polar = (mag: number, deg: number): Cx => [mag * Math.cos((deg * Math.PI) / 180), mag * Math.sin((deg * Math.PI) / 180)];
const ONE: Cx = [1, 0];

/**
 * Characteristic impedance and effective permittivity of a symmetric line section from its
 * S-parameters: S → ABCD (Pozar, Microwave Engineering, 4th ed., Table 4.2), and the ABCD
 * matrix of a line is [cosh γl, Zc sinh γl; sinh γl / Zc, cosh γl] (Pozar Table 4.1).
 */
function lineFromS(s11: Cx, s21: Cx, refOhm: number, freqHz: number, lengthM: number) {
  const twoS21 = mul([2, 0], s21);
  const s21sq = mul(s21, s21);
  const a = div(add(mul(add(ONE, s11), sub(ONE, s11)), s21sq), twoS21);
  const b = div(sub(mul(add(ONE, s11), add(ONE, s11)), s21sq), twoS21);
  const c = div(sub(mul(sub(ONE, s11), sub(ONE, s11)), s21sq), twoS21);
  const zc = mul([refOhm, 0], sqrt(div(b, c)));
  const gammaL = log(add(a, sqrt(sub(mul(a, a), ONE))));
  const beta = Math.abs(gammaL[1]) / lengthM;
  return { z0: zc[0], ee: ((beta * 299_792_458) / (2 * Math.PI * freqHz)) ** 2 };
}

describe("cpwImpedance", () => {
  it("matches the scikit-rf check value on an infinite substrate within 1 %", () => {
    // scikit-rf, skrf/media/tests/test_cpw.py (test_Z0, test_ep_reff): w 40 µm, s 20 µm,
    // εr 3.78, substrate effectively infinite → Z0 77.93 Ω (wcalc), εe 2.39.
    const est = cpwImpedance({ widthUm: 40, gapUm: 20, er: 3.78 });
    expect(Math.abs(est.z0Ohm - 77.93) / 77.93).toBeLessThan(0.01);
    expect(Math.abs(est.effectivePermittivity - 2.39) / 2.39).toBeLessThan(0.01);
  });

  it("reduces to the infinite-substrate form as the height grows", () => {
    const infinite = cpwImpedance({ widthUm: 40, gapUm: 20, er: 12.9 });
    for (const backed of [false, true]) {
      const deep = cpwImpedance({ widthUm: 40, gapUm: 20, er: 12.9, heightUm: 1e7, backed });
      expect(deep.z0Ohm / infinite.z0Ohm).toBeCloseTo(1, 6);
      expect(deep.effectivePermittivity / infinite.effectivePermittivity).toBeCloseTo(1, 6);
    }
  });

  it("matches simulator data for a finite substrate with air below, within 1 %", () => {
    // scikit-rf test data file cpw,t=0um.s2p in skrf/media/tests (a circuit simulator's output;
    // w 3.0 mm, s 0.3 mm, h 1.55 mm, εr 4.5, 25 mm long, per skrf/media/tests/test_cpw.py),
    // row at 1 GHz. Lossy reference (tan δ 0.018), lossless model: compare within 1 %.
    const ref = lineFromS(polar(0.0066874715, 173.427251), polar(0.994298729, -47.2849589), 50, 1e9, 0.025);
    const est = cpwImpedance({ widthUm: 3000, gapUm: 300, er: 4.5, heightUm: 1550 });
    expect(Math.abs(est.z0Ohm - ref.z0) / ref.z0).toBeLessThan(0.01);
    expect(Math.abs(est.effectivePermittivity - ref.ee) / ref.ee).toBeLessThan(0.01);
  });

  it("matches simulator data for conductor-backed CPW, within 1 %", () => {
    // scikit-rf test data file cpwg,t=0um.s2p in skrf/media/tests (w 1.6 mm, s 0.3 mm, h 1.55 mm,
    // εr 4.5, metal backside, 25 mm long), row at 1 GHz.
    const ref = lineFromS(polar(0.00646679186, 154.171811), polar(0.993291481, -51.0016244), 50, 1e9, 0.025);
    const est = cpwImpedance({ widthUm: 1600, gapUm: 300, er: 4.5, heightUm: 1550, backed: true });
    expect(Math.abs(est.z0Ohm - ref.z0) / ref.z0).toBeLessThan(0.01);
    expect(Math.abs(est.effectivePermittivity - ref.ee) / ref.ee).toBeLessThan(0.01);
  });

  it("gives εe = 1 in a homogeneous medium", () => {
    // With εr = 1 every filling factor multiplies zero: εe = 1 exactly.
    for (const heightUm of [undefined, 50]) {
      for (const backed of heightUm === undefined ? [false] : [false, true]) {
        expect(cpwImpedance({ widthUm: 40, gapUm: 20, er: 1, heightUm, backed }).effectivePermittivity).toBeCloseTo(1, 12);
      }
    }
  });

  it("lowers Z0 when a backside ground is added", () => {
    const open = cpwImpedance({ widthUm: 60, gapUm: 40, er: 12.9, heightUm: 100 }).z0Ohm;
    const backed = cpwImpedance({ widthUm: 60, gapUm: 40, er: 12.9, heightUm: 100, backed: true }).z0Ohm;
    expect(backed).toBeLessThan(open);
  });

  it("stays finite on a very thin substrate and rejects an impossibly thin one", () => {
    const thin = cpwImpedance({ widthUm: 40, gapUm: 20, er: 12.9, heightUm: 0.5 });
    expect(Number.isFinite(thin.z0Ohm)).toBe(true);
    expect(thin.effectivePermittivity).toBeGreaterThan(1);
    expect(() => cpwImpedance({ widthUm: 40, gapUm: 20, er: 12.9, heightUm: 0.01, backed: true })).toThrow(EstimateInputError);
  });

  it("needs a height for a backed line and warns on an infinite substrate", () => {
    expect(() => cpwImpedance({ widthUm: 40, gapUm: 20, er: 12.9, backed: true })).toThrow(/heightUm/);
    expect(cpwImpedance({ widthUm: 40, gapUm: 20, er: 12.9 }).warnings).toHaveLength(1);
  });
});
