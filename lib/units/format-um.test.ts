import { describe, expect, it } from "vitest";
import { formatUm, roundUm, umDecimals } from "./format-um";

// Ground truth worked by hand: the last shown digit must not be finer than one pixel.
describe("µm formatting by scale", () => {
  it("chooses decimals from the pixel size", () => {
    expect(umDecimals(0.45)).toBe(1);
    expect(umDecimals(1.33)).toBe(0);
    expect(umDecimals(1)).toBe(0);
    expect(umDecimals(0.1)).toBe(1);
    expect(umDecimals(0.05)).toBe(2);
    expect(umDecimals(null)).toBe(2);
    expect(umDecimals(0)).toBe(2);
  });
  it("removes float noise", () => {
    expect(formatUm(2393.9998965514333, 1.33)).toBe("2394");
    expect(formatUm(26.999981, 0.45)).toBe("27.0");
    expect(roundUm(26.999981, 0.45)).toBe(27);
    expect(roundUm(-0.00001, 0.45)).toBe(0);
    expect(formatUm(12.345)).toBe("12.35");
  });
});
