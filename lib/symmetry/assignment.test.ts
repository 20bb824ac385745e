import { describe, it, expect } from "vitest";
import type { LineStringGeometry } from "../geometry/types";
import { symmetryReport } from "./report";
import type { SymmetryShape } from "./types";

/** Axis y = 0; mirror images are (x, −y), written by hand. */
const AXIS: LineStringGeometry = {
  type: "LineString",
  coordinates: [
    [0, 0],
    [1, 0],
  ],
};

const pad = (id: string, x: number, y: number): SymmetryShape => ({ id, kind: "pad", geometry: { type: "Point", coordinates: [x, y] } });

/** Cost of pairing left shape a (y > 0) with right shape b (y < 0): |a − (b.x, −b.y)|. */
function cost(a: [number, number], b: [number, number]): number {
  return Math.hypot(a[0] - b[0], a[1] + b[1]);
}

/** Every permutation of 0..n−1 (Heap's algorithm). */
function permutations(n: number): number[][] {
  const out: number[][] = [];
  const a = Array.from({ length: n }, (_, i) => i);
  const c = new Array<number>(n).fill(0);
  out.push([...a]);
  for (let i = 0; i < n;) {
    if (c[i] < i) {
      const j = i % 2 === 0 ? 0 : c[i];
      [a[j], a[i]] = [a[i], a[j]];
      out.push([...a]);
      c[i]++;
      i = 0;
    } else {
      c[i] = 0;
      i++;
    }
  }
  return out;
}

/** Independent check: the smallest total cost over all permutations. */
function bruteForceMin(left: [number, number][], right: [number, number][]): number {
  return Math.min(...permutations(left.length).map((perm) => perm.reduce((s, j, i) => s + cost(left[i], right[j]), 0)));
}

/** Greedy nearest-neighbour pairing: repeatedly take the cheapest remaining pair. */
function greedyTotal(left: [number, number][], right: [number, number][]): number {
  const usedL = new Set<number>();
  const usedR = new Set<number>();
  let total = 0;
  while (usedL.size < left.length) {
    let best = { i: -1, j: -1, c: Infinity };
    left.forEach((a, i) =>
      right.forEach((b, j) => {
        if (!usedL.has(i) && !usedR.has(j) && cost(a, b) < best.c) best = { i, j, c: cost(a, b) };
      }),
    );
    usedL.add(best.i);
    usedR.add(best.j);
    total += best.c;
  }
  return total;
}

/** Deterministic pseudo-random numbers (mulberry32) so the test is repeatable. */
function rng(seed: number): () => number {
  let t = seed;
  return () => {
    t = (t + 0x6d2b79f5) | 0;
    let r = Math.imul(t ^ (t >>> 15), 1 | t);
    r ^= r + Math.imul(r ^ (r >>> 7), 61 | r);
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296;
  };
}

describe("optimal pairing", () => {
  it("beats greedy nearest-neighbour where greedy goes wrong", () => {
    // Mirror images of B1, B2 land at (1, 10) and (−2, 10): costs A1–B1 1, A1–B2 2, A2–B1 3, A2–B2 6.
    // Greedy takes A1–B1 first and is left with A2–B2: 1 + 6 = 7. Optimal is A1–B2 + A2–B1 = 5.
    const left: [number, number][] = [
      [0, 10],
      [4, 10],
    ];
    const right: [number, number][] = [
      [1, -10],
      [-2, -10],
    ];
    const shapes = [pad("A1", 0, 10), pad("A2", 4, 10), pad("B1", 1, -10), pad("B2", -2, -10)];
    const report = symmetryReport(shapes, AXIS, { maxDistanceUm: 15 });
    expect(greedyTotal(left, right)).toBeCloseTo(7, 12);
    expect(bruteForceMin(left, right)).toBeCloseTo(5, 12);
    expect(report.summary.totalDeviationUm).toBeCloseTo(5, 12);
    expect(report.pairs.find((p) => p.aId === "A1")?.bId).toBe("B2");
  });

  it("matches a brute-force search over all permutations on random layouts", () => {
    // Shapes sit far from the axis (self-pairing would cost ≥ 2000 µm, above the cut-off) and
    // every cross pair is under the cut-off, so the optimum is a full permutation.
    const random = rng(24);
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + (trial % 6);
      const left: [number, number][] = Array.from({ length: n }, () => [random() * 300, 1000 + random() * 300]);
      const right: [number, number][] = left.map(([x, y]) => [x + (random() - 0.5) * 120, -y + (random() - 0.5) * 120]);
      const shapes = [...left.map(([x, y], i) => pad(`L${i}`, x, y)), ...right.map(([x, y], i) => pad(`R${i}`, x, y))];
      const report = symmetryReport(shapes, AXIS, { maxDistanceUm: 1000 });
      expect(report.unmatched).toEqual([]);
      expect(report.summary.totalDeviationUm).toBeCloseTo(bruteForceMin(left, right), 9);
      expect(report.summary.totalDeviationUm).toBeLessThanOrEqual(greedyTotal(left, right) + 1e-9);
    }
  });

  it("leaves the surplus shapes of the larger side unmatched", () => {
    const shapes = [pad("A1", 0, 100), pad("A2", 500, 100), pad("B1", 2, -100)];
    const report = symmetryReport(shapes, AXIS, { maxDistanceUm: 20 });
    expect(report.pairs.map((p) => [p.aId, p.bId])).toEqual([["A1", "B1"]]);
    expect(report.unmatched.map((u) => u.id)).toEqual(["A2"]);
  });
});
