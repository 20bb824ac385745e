import { describe, it, expect } from "vitest";
import { parseKnownLength } from "./known-length";

describe("parseKnownLength", () => {
  it("reads plain, decimal-comma and exponent lengths", () => {
    expect(parseKnownLength(" 250 ")).toEqual({ ok: true, value: 250 });
    expect(parseKnownLength("12,5")).toEqual({ ok: true, value: 12.5 });
    expect(parseKnownLength("1.5e3")).toEqual({ ok: true, value: 1500 });
  });

  it("refuses empty, non-numeric, zero, negative and infinite lengths with a message", () => {
    for (const t of ["", "abc", "12 µm", "0", "-5", "1e400", "Infinity"]) {
      const r = parseKnownLength(t);
      expect(r.ok, t).toBe(false);
      if (!r.ok) expect(r.message.length).toBeGreaterThan(0);
    }
  });
});
