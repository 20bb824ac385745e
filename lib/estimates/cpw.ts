/**
 * Coplanar waveguide, quasi-static, zero-thickness conductors, by conformal mapping.
 * - Infinite substrate: Wen, IEEE T-MTT 17(12), 1969.
 * - Finite substrate, air below: Ghione & Naldi, Electronics Letters 20(4), 1984; Simons,
 *   Coplanar Waveguide Circuits, Components and Systems, 2001, ch. 2.
 * - Conductor-backed: Ghione & Naldi, Electronics Letters 19(18), 1983, eqs (4), (7), (8);
 *   Simons 2001, ch. 3. These expressions were first written from memory of Simons, then
 *   checked term by term against scikit-rf's implementation of the 1983 paper
 *   (skrf/media/cpw.py) and against simulator data in the tests; Simons's book itself was not
 *   re-read.
 * Naming: w is the centre strip width, s the slot (gap) width; some books swap the letters.
 */
import { ETA0 } from "./constants";
import { backedSubstrateModulus, centreModulus, finiteSubstrateModulus } from "./cpw-moduli";
import { ellipticKRatio } from "./elliptic";
import { EstimateInputError, requirePermittivity, requirePositive } from "./input-error";
import type { EstimateMeta } from "./types";

export type CpwInput = {
  /** Centre strip width. */
  widthUm: number;
  /** Slot between the strip and each ground. */
  gapUm: number;
  er: number;
  /** Substrate height; absent means an infinitely thick substrate. */
  heightUm?: number;
  /** Metal on the back of the substrate (grounded / conductor-backed CPW). */
  backed?: boolean;
};

export type CpwEstimate = EstimateMeta & { z0Ohm: number; effectivePermittivity: number };

type Line = { z0: number; ee: number; formula: string };

/** q = K(k)/K(k′) for a modulus pair. */
const q = (p: { k: number; kPrime: number }) => ellipticKRatio(p.k, p.kPrime);

/** Wen / Ghione & Naldi, air below: εe = 1 + (εr − 1)/2·q1/q0, Z0 = (30π/√εe)/q0. */
function unbacked(w: number, s: number, er: number, h: number | undefined): Line {
  const q0 = q(centreModulus(w, s));
  const ee = h === undefined ? (er + 1) / 2 : 1 + ((er - 1) / 2) * (q(finiteSubstrateModulus(w, s, h)) / q0);
  const formula =
    h === undefined
      ? "εe = (εr + 1)/2, Z0 = (30π/√εe)·K(k0′)/K(k0), k0 = w/(w + 2s)"
      : "εe = 1 + (εr − 1)/2·[K(k1)/K(k1′)]·[K(k0′)/K(k0)], k1 = sinh(πw/4h)/sinh(π(w + 2s)/4h), Z0 = (30π/√εe)·K(k0′)/K(k0)";
  return { z0: ETA0 / 4 / (Math.sqrt(ee) * q0), ee, formula };
}

/** Conductor-backed: εe = (q0 + εr·q3)/(q0 + q3), Z0 = (60π/√εe)/(q0 + q3). */
function backed(w: number, s: number, er: number, h: number): Line {
  const q0 = q(centreModulus(w, s));
  const q3 = q(backedSubstrateModulus(w, s, h));
  const ee = (q0 + er * q3) / (q0 + q3);
  return {
    z0: ETA0 / 2 / (Math.sqrt(ee) * (q0 + q3)),
    ee,
    formula:
      "k3 = tanh(πw/4h)/tanh(π(w + 2s)/4h); εe = (1 + εr·K(k0′)K(k3)/(K(k0)K(k3′)))/(1 + K(k0′)K(k3)/(K(k0)K(k3′))); " +
      "Z0 = (60π/√εe)/(K(k0)/K(k0′) + K(k3)/K(k3′))",
  };
}

/** Characteristic impedance and effective permittivity of a coplanar waveguide. */
export function cpwImpedance(input: CpwInput): CpwEstimate {
  const w = requirePositive("widthUm", input.widthUm);
  const s = requirePositive("gapUm", input.gapUm);
  const er = requirePermittivity("er", input.er);
  const h = input.heightUm === undefined ? undefined : requirePositive("heightUm", input.heightUm);
  const warnings: string[] = [];
  if (input.backed && h === undefined) throw new EstimateInputError("heightUm", "heightUm is required for conductor-backed CPW");
  if (h === undefined) warnings.push("substrate taken as infinitely thick: valid when its height is several times widthUm + 2·gapUm");
  else if (input.backed && h < w + 2 * s) {
    warnings.push("backside ground closer than widthUm + 2·gapUm: the line behaves more like microstrip and parallel-plate modes are easily excited");
  }
  const line = input.backed && h !== undefined ? backed(w, s, er, h) : unbacked(w, s, er, h);
  if (!Number.isFinite(line.z0) || !Number.isFinite(line.ee) || line.z0 <= 0) {
    throw new EstimateInputError("heightUm", "heightUm is too small relative to widthUm + 2·gapUm for this formula");
  }
  return {
    z0Ohm: line.z0,
    effectivePermittivity: line.ee,
    units: { z0Ohm: "Ω", effectivePermittivity: "1" },
    formula: `${line.formula} (quasi-static, zero-thickness conductors)`,
    source: input.backed
      ? "Ghione & Naldi, Electronics Letters 19(18), 1983; Simons, Coplanar Waveguide Circuits, Components and Systems, 2001"
      : h === undefined
        ? "Wen, IEEE Trans. MTT 17(12), 1969"
        : "Ghione & Naldi, Electronics Letters 20(4), 1984; Simons, Coplanar Waveguide Circuits, Components and Systems, 2001",
    warnings,
  };
}
