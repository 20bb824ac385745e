import { describe, expect, it } from "vitest";
import { excerpt, inboxText } from "./inbox-text";

describe("inbox text", () => {
  it("names who, what and which die, with the comment's words", () => {
    expect(inboxText({ kind: "mention", author: "Demo Owner", dieName: "NV-2 die A", body: "please check\n\nthe  pad ring" })).toBe(
      "Demo Owner named you in a remark on NV-2 die A: please check the pad ring",
    );
    expect(inboxText({ kind: "review", action: "return", author: "Demo Reviewer", dieName: "NV-2 die A", message: "" })).toBe(
      "Demo Reviewer returned NV-2 die A with remarks",
    );
    expect(inboxText({ kind: "review", action: "send", author: "Demo Analyst", dieName: "D", message: "ready" })).toBe(
      "Demo Analyst sent D to the checker: ready",
    );
  });

  it("cuts long text at a word near the limit, never inside a surrogate pair", () => {
    const long = "word ".repeat(100);
    const cut = excerpt(long, 20);
    expect(cut).toBe("word word word word…");
    // 25 emoji (each two UTF-16 code units): a cut by code units would leave a lone surrogate.
    const emoji = "😀".repeat(25);
    const e = excerpt(emoji, 10);
    expect(e).toBe(`${"😀".repeat(10)}…`);
    expect(e.isWellFormed()).toBe(true);
  });
});
