import { describe, it, expect } from "vitest";
import { retryDelayMs } from "./backoff";

// Exponential back-off (common practice): base · 2^(n−1), capped. Values worked by hand.
describe("retryDelayMs", () => {
  it("doubles from the base delay", () => {
    expect([1, 2, 3, 4].map((n) => retryDelayMs(n, 1000))).toEqual([1000, 2000, 4000, 8000]);
  });

  it("stops at the cap and waits nothing before the first attempt", () => {
    expect(retryDelayMs(30, 1000, 60_000)).toBe(60_000);
    expect(retryDelayMs(0, 1000)).toBe(0);
  });
});
