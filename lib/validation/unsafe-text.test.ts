import { describe, expect, it } from "vitest";
import { findUnsafeText, formTextProblem } from "./unsafe-text";

// Ground truth: PostgreSQL's text type refuses U+0000 (PostgreSQL docs, "Character Types");
// Unicode 15 §3.9 D76 — surrogate code points are not scalar values, so a lone one is not text.
describe("findUnsafeText", () => {
  it("finds a NUL with its path", () => {
    expect(findUnsafeText(JSON.parse('{"title":"ok","notes":["a","b\\u0000c"]}'))).toEqual({ path: "notes.1", problem: "contains a NUL character" });
  });
  it("finds lone surrogates, high or low, and accepts a proper pair", () => {
    expect(findUnsafeText(JSON.parse('{"label":"x\\ud800"}'))?.path).toBe("label");
    expect(findUnsafeText(JSON.parse('{"label":"\\udc00x"}'))?.path).toBe("label");
    expect(findUnsafeText(JSON.parse('{"label":"pad \\ud83d\\ude00 Ω µm"}'))).toBeNull();
  });
  it("passes ordinary values and reports the first bad one in document order", () => {
    expect(findUnsafeText({ a: 1, b: [true, null, "x"] })).toBeNull();
    expect(findUnsafeText({ a: "\u0000", b: "\u0000" })?.path).toBe("a");
  });
});

describe("formTextProblem", () => {
  it("names the form field holding a NUL or a lone surrogate, and passes clean forms", () => {
    const form = new FormData();
    form.set("token", "abc");
    form.set("name", "Demo\u0000Analyst");
    expect(formTextProblem(form)).toBe("name contains a NUL character.");
    // FormData itself stores USVStrings (a lone surrogate becomes U+FFFD), so a plain map stands in.
    expect(formTextProblem(new Map([["name", "half \ud83d pair"]]))).toMatch(/^name contains a lone surrogate/);
    form.set("name", "Demo Analyst 🔬");
    expect(formTextProblem(form)).toBeNull();
  });
});
