/**
 * Elliptic moduli of the coplanar-waveguide conformal maps, each with its complementary
 * modulus computed directly (not as √(1 − k²)), because k tends to 1 on thin substrates and
 * 1 − k² would lose every digit. Hyperbolic functions are taken in log form so that very thin
 * substrates (πw/4h in the hundreds) do not overflow.
 */

export type ModulusPair = { k: number; kPrime: number };

const LN2 = Math.LN2;

/** ln sinh x for x > 0. */
function logSinh(x: number): number {
  return x < 20 ? Math.log(Math.sinh(x)) : x - LN2 + Math.log1p(-Math.exp(-2 * x));
}

/** ln cosh x for x ≥ 0. */
function logCosh(x: number): number {
  return x < 20 ? Math.log(Math.cosh(x)) : x - LN2 + Math.log1p(Math.exp(-2 * x));
}

/** k0 = w/(w + 2s), k0′ = 2√(s(w + s))/(w + 2s): strip width w, slot s (infinite substrate). */
export function centreModulus(w: number, s: number): ModulusPair {
  return { k: w / (w + 2 * s), kPrime: (2 * Math.sqrt(s * (w + s))) / (w + 2 * s) };
}

/**
 * Finite substrate of height h, air below (Ghione & Naldi 1984):
 * k1 = sinh(πw/4h)/sinh(π(w + 2s)/4h); k1′² = sinh(b + a)·sinh(b − a)/sinh²b.
 */
export function finiteSubstrateModulus(w: number, s: number, h: number): ModulusPair {
  const a = (Math.PI * w) / (4 * h);
  const b = (Math.PI * (w + 2 * s)) / (4 * h);
  const lnK = logSinh(a) - logSinh(b);
  const lnKp2 = logSinh(b + a) + logSinh(b - a) - 2 * logSinh(b);
  return { k: Math.exp(lnK), kPrime: Math.exp(lnKp2 / 2) };
}

/**
 * Conductor-backed substrate of height h (Ghione & Naldi 1983):
 * k3 = tanh(πw/4h)/tanh(π(w + 2s)/4h); k3′² = sinh(b + a)·sinh(b − a)/(cosh²a·sinh²b).
 */
export function backedSubstrateModulus(w: number, s: number, h: number): ModulusPair {
  const a = (Math.PI * w) / (4 * h);
  const b = (Math.PI * (w + 2 * s)) / (4 * h);
  const lnK = logSinh(a) - logCosh(a) - logSinh(b) + logCosh(b);
  const lnKp2 = logSinh(b + a) + logSinh(b - a) - 2 * logCosh(a) - 2 * logSinh(b);
  return { k: Math.exp(lnK), kPrime: Math.exp(lnKp2 / 2) };
}
