/**
 * Complete elliptic integral of the first kind by the arithmetic-geometric mean
 * (DLMF §19.8.5): K = π / (2·AGM(1, k′)).
 *
 * Modulus k versus parameter m — the usual trap:
 * - `ellipticK(m)` takes the PARAMETER m = k², like Abramowitz & Stegun Table 17.1 and
 *   @stdlib's `ellipk(m)`. K(m = 0.5) = 1.8540746773013719.
 * - The coplanar-waveguide formulas are written with the MODULUS k (k0 = w/(w + 2s)), and so is
 *   Hilberg's approximation; `ellipticKRatio(k, k′)` therefore takes moduli.
 * Passing k where m is expected silently gives a wrong (but plausible) number.
 */

const MAX_ITERATIONS = 64;

/** Arithmetic-geometric mean of two non-negative numbers (quadratic convergence). */
export function agm(a0: number, b0: number): number {
  if (a0 === 0 || b0 === 0) return 0;
  let a = a0;
  let b = b0;
  for (let i = 0; i < MAX_ITERATIONS && Math.abs(a - b) > 1e-15 * a; i++) {
    const next = (a + b) / 2;
    b = Math.sqrt(a * b);
    a = next;
  }
  return (a + b) / 2;
}

/**
 * K(m) for parameter m = k² < 1 (negative m is allowed); K(1) = +∞; throws RangeError for m > 1.
 */
export function ellipticK(m: number): number {
  if (Number.isNaN(m) || m > 1) throw new RangeError("ellipticK: parameter m must be at most 1");
  if (m === 1) return Infinity;
  return Math.PI / (2 * agm(1, Math.sqrt(1 - m)));
}

/**
 * K(k)/K(k′) for modulus k and complementary modulus k′ = √(1 − k²).
 * Since K(k) = π/(2·AGM(1, k′)) and K(k′) = π/(2·AGM(1, k)), the ratio is AGM(1, k)/AGM(1, k′).
 * Pass k′ when it is known more accurately than √(1 − k²) (k close to 1).
 */
export function ellipticKRatio(k: number, kPrime: number = Math.sqrt((1 - k) * (1 + k))): number {
  if (!(k >= 0 && k <= 1 && kPrime >= 0 && kPrime <= 1)) {
    throw new RangeError("ellipticKRatio: moduli must lie in [0, 1]");
  }
  return agm(1, k) / agm(1, kPrime);
}
