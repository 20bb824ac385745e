/**
 * Partial inductances of straight round wires and of n equal wires side by side, in SI.
 * Grover, Inductance Calculations (1946); the self term is Rosa (1908).
 */
import { MU0 } from "./constants";

const MU0_OVER_2PI = MU0 / (2 * Math.PI);

/**
 * Self inductance (H) of a straight round wire of length l and radius r (m), free space:
 * 2·10⁻⁷·l·[ln(2l/r) − 0.75]; at high frequency (current on the surface) the constant is −1.
 */
export function roundWireSelf(l: number, r: number, regime: "dc" | "hf"): number {
  return MU0_OVER_2PI * l * (Math.log((2 * l) / r) - (regime === "dc" ? 0.75 : 1));
}

/**
 * Mutual inductance (H) of two equal parallel filaments of length l at spacing p (m), ends
 * aligned: 2·10⁻⁷·l·[ln(l/p + √(1 + l²/p²)) − √(1 + p²/l²) + p/l] (Grover).
 */
export function parallelMutual(l: number, p: number): number {
  const q = l / p;
  return MU0_OVER_2PI * l * (Math.log(q + Math.sqrt(1 + q * q)) - Math.sqrt(1 + 1 / (q * q)) + 1 / q);
}

/** n×n partial-inductance matrix of n wires in a row at equal pitch. */
export function partialInductanceMatrix(self: number, l: number, pitch: number, n: number): number[][] {
  const mutualAt = [self];
  for (let k = 1; k < n; k++) mutualAt.push(parallelMutual(l, k * pitch));
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => mutualAt[Math.abs(i - j)]));
}

/**
 * Loop-free inductance of n wires joined at both ends when each carries the same current
 * (what resistance alone would impose on equal wires): (Σᵢ Σⱼ Lᵢⱼ)/n².
 * For n = 2 this is Grover's (L + M)/2.
 */
export function equalCurrentInductance(matrix: number[][]): number {
  const n = matrix.length;
  let sum = 0;
  for (const row of matrix) for (const v of row) sum += v;
  return sum / (n * n);
}

/**
 * Inductance of the same bundle when the current divides by inductance alone (equal voltage
 * across every wire, high frequency): 1/(1ᵀ·L⁻¹·1). It is never above the equal-current value
 * (the inductive split minimises magnetic energy), and equals it for n ≤ 2 by symmetry.
 */
export function inductiveSplitInductance(matrix: number[][]): number {
  const x = solve(
    matrix,
    matrix.map(() => 1),
  );
  return 1 / x.reduce((a, b) => a + b, 0);
}

/** Gaussian elimination with partial pivoting; the matrices here are small and well conditioned. */
function solve(a: number[][], b: number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      for (let c = col; c <= n; c++) m[r][c] -= f * m[col][c];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c];
    x[r] = s / m[r][r];
  }
  return x;
}
