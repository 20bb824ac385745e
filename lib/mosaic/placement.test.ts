import { describe, expect, it } from "vitest";
import { applyStageModel, placeFrames, type MeasuredPair } from "./placement";
import type { MosaicPair } from "./types";

const measured = (a: number, b: number, dx: number, dy: number, peak = 0.9): MosaicPair => ({ a, b, dx, dy, peak, used: "measured" });

describe("placeFrames", () => {
  it("reproduces consistent translations exactly, frame 0 at the origin", () => {
    // Ground truth: a 2 × 2 grid at known positions; every pair is their exact difference.
    const truth = [
      { x: 0, y: 0 },
      { x: 100, y: 3 },
      { x: -2, y: 80 },
      { x: 97, y: 84 },
    ];
    const pairs = [
      [0, 1],
      [2, 3],
      [0, 2],
      [1, 3],
    ].map(([a, b]) => measured(a, b, truth[b].x - truth[a].x, truth[b].y - truth[a].y));
    const { positions, residualPx } = placeFrames(4, pairs);
    positions.forEach((p, i) => {
      expect(p.x).toBeCloseTo(truth[i].x, 9);
      expect(p.y).toBeCloseTo(truth[i].y, 9);
    });
    expect(residualPx.max).toBeLessThan(1e-9);
  });

  it("splits a loop's disagreement by weight: the weighted mean of the two routes", () => {
    // Reference: for frame 1 reached directly (t = 10, weight w1) and through frame 2
    // (5 + 7 = 12, each leg weight w2), least squares gives the closed form below.
    const w1 = 0.9 ** 2;
    const w2 = 0.6 ** 2;
    const pairs = [measured(0, 1, 10, 0, 0.9), measured(0, 2, 5, 0, 0.6), measured(2, 1, 7, 0, 0.6)];
    const { positions } = placeFrames(3, pairs);
    const series = w2 / 2; // two legs of weight w2 in series
    expect(positions[1].x).toBeCloseTo((w1 * 10 + series * 12) / (w1 + series), 9);
  });

  it("refuses pairs that leave a frame unconnected", () => {
    expect(() => placeFrames(3, [measured(0, 1, 10, 0)])).toThrow(RangeError);
  });
});

describe("applyStageModel", () => {
  const pair = (a: number, b: number, direction: MeasuredPair["direction"], dx: number, dy: number, peak: number): MeasuredPair => ({
    a,
    b,
    direction,
    nominal: direction === "horizontal" ? { dx: 90, dy: 0 } : { dx: 0, dy: 70 },
    dx,
    dy,
    peak,
  });

  it("replaces a weak pair by the median of the trusted pairs in its direction and names it", () => {
    const { pairs, warnings } = applyStageModel([
      pair(0, 1, "horizontal", 91, 1, 0.9),
      pair(1, 2, "horizontal", 93, 2, 0.8),
      pair(2, 3, "horizontal", 40, 30, 0.05),
      pair(3, 4, "horizontal", 92, 0, 0.7),
      pair(0, 5, "vertical", 1, 72, 0.9),
    ]);
    expect(pairs[2]).toEqual({ a: 2, b: 3, dx: 92, dy: 1, peak: 0.05, used: "stage_model" });
    expect(pairs.filter((p) => p.used === "measured")).toHaveLength(4);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatch(/^Frames 3 and 4: .*median/);
  });

  it("falls back to the nominal overlap when no pair in that direction is trusted", () => {
    const { pairs, warnings } = applyStageModel([pair(0, 1, "vertical", 3, 20, 0.1), pair(0, 2, "horizontal", 91, 0, 0.9)]);
    expect(pairs[0]).toMatchObject({ dx: 0, dy: 70, used: "stage_model" });
    expect(warnings[0]).toMatch(/nominal overlap/);
  });
});
