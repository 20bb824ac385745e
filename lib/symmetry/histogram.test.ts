import { describe, it, expect } from "vitest";
import { axisDecimals, deviationHistogram } from "./histogram";

describe("deviationHistogram", () => {
  it("counts values into equal bins from zero to the largest", () => {
    const bins = deviationHistogram([0, 0.5, 1, 1.5, 2], 4);
    expect(bins.map((b) => b.count)).toEqual([1, 1, 1, 2]);
    expect(bins[0].fromUm).toBe(0);
    expect(bins[3].toUm).toBe(2);
    expect(bins.reduce((s, b) => s + b.count, 0)).toBe(5);
  });

  it("keeps drawable bins when every value is zero or there are none", () => {
    expect(deviationHistogram([0, 0, 0], 2)).toEqual([
      { fromUm: 0, toUm: 0.5, count: 3 },
      { fromUm: 0.5, toUm: 1, count: 0 },
    ]);
    expect(deviationHistogram([], 3).map((b) => b.count)).toEqual([0, 0, 0]);
  });

  it("skips non-finite values and rejects a bad bin count", () => {
    expect(deviationHistogram([1, Number.NaN, Infinity], 1)[0].count).toBe(1);
    expect(() => deviationHistogram([1], 0)).toThrow(RangeError);
    expect(() => deviationHistogram([1], 2.5)).toThrow(RangeError);
  });
});

describe("axisDecimals", () => {
  // By hand: one unit of the last digit is at most a tenth of the span.
  it("gives small spreads enough decimals that the axis ends differ", () => {
    expect(axisDecimals(0, 0.03)).toBe(3); // 0.000 … 0.030, not 0.0 … 0.0
    expect((0.03).toFixed(axisDecimals(0, 0.03))).not.toBe((0).toFixed(axisDecimals(0, 0.03)));
    expect(axisDecimals(0, 1)).toBe(1);
    expect(axisDecimals(0, 12)).toBe(0);
    expect(axisDecimals(0, 0.0004)).toBe(5);
    expect(axisDecimals(2, 2)).toBe(1);
  });
});
