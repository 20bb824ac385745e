/**
 * Optimal pairing of the shapes on one side of the axis with those on the other, by the
 * Hungarian (Munkres) algorithm, with a cut-off and with self-pairing for shapes on the axis.
 *
 * The square matrix has rows P ∪ N′ and columns N ∪ P′, where P and N are the shapes on the
 * two sides and P′, N′ one "alone" slot per shape:
 *   P_i × N_j  = cross cost, or ∞ above the cut-off;
 *   P_i × P′_i = alone cost of P_i (∞ off the diagonal);
 *   N′_j × N_j = alone cost of N_j (∞ off the diagonal);
 *   N′ × P′    = 0 (filler, one for every cross pair made).
 * A shape's alone cost is its self cost when it may pair with itself, else the cut-off; so a
 * pair under the cut-off always beats leaving its two shapes alone, and the total minimised is
 * Σ pair costs + cut-off × (number of unmatched shapes).
 */
import munkres from "munkres";

export type AloneChoice = { readonly cost: number; readonly self: boolean };

export type Assignment = {
  /** [i, j]: P_i with N_j. */
  readonly cross: [number, number][];
  /** Indices into P (side "p") or N (side "n") paired with themselves. */
  readonly selfP: number[];
  readonly selfN: number[];
  readonly unmatchedP: number[];
  readonly unmatchedN: number[];
};

/** Alone option for one shape: self-pair when its self cost is within the cut-off. */
export function aloneChoice(selfCost: number, maxCost: number): AloneChoice {
  return selfCost <= maxCost ? { cost: selfCost, self: true } : { cost: maxCost, self: false };
}

function buildMatrix(cross: number[][], aloneP: AloneChoice[], aloneN: AloneChoice[], maxCost: number): number[][] {
  const p = aloneP.length;
  const n = aloneN.length;
  return Array.from({ length: p + n }, (_, r) =>
    Array.from({ length: n + p }, (_, c) => {
      if (r < p && c < n) return cross[r][c] <= maxCost ? cross[r][c] : Infinity;
      if (r < p) return c - n === r ? aloneP[r].cost : Infinity;
      if (c < n) return r - p === c ? aloneN[c].cost : Infinity;
      return 0;
    }),
  );
}

/** Solves the pairing; `cross[i][j]` is the cost of P_i with N_j. */
export function assignPairs(cross: number[][], aloneP: AloneChoice[], aloneN: AloneChoice[], maxCost: number): Assignment {
  const p = aloneP.length;
  const n = aloneN.length;
  const result: Assignment = { cross: [], selfP: [], selfN: [], unmatchedP: [], unmatchedN: [] };
  if (p + n === 0) return result;
  for (const [r, c] of munkres(buildMatrix(cross, aloneP, aloneN, maxCost))) {
    if (r < p && c < n) result.cross.push([r, c]);
    else if (r < p) (aloneP[r].self ? result.selfP : result.unmatchedP).push(r);
    else if (c < n) (aloneN[c].self ? result.selfN : result.unmatchedN).push(c);
  }
  return result;
}
