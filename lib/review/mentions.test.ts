import { describe, it, expect } from "vitest";
import { mentionQueryAt, resolveMentions } from "./mentions";

const members = [
  { userId: "a", name: "Demo Analyst", email: "analyst@fjordlight.test" },
  { userId: "r", name: "Demo Reviewer", email: "reviewer@fjordlight.test" },
  { userId: "d", name: "Demo", email: "demo@fjordlight.test" },
];

describe("resolveMentions", () => {
  it("finds members by display name or e-mail, case-insensitively", () => {
    expect(resolveMentions("@demo analyst please look; cc @reviewer@fjordlight.test", members).sort()).toEqual(["a", "r"]);
  });

  it("prefers the longest matching name", () => {
    expect(resolveMentions("@Demo Reviewer", members)).toEqual(["r"]);
    expect(resolveMentions("@Demo, thanks", members)).toEqual(["d"]);
  });

  it("ignores names that are not members and @ inside words", () => {
    expect(resolveMentions("@outsider@elsewhere.test and me@Demo", members)).toEqual([]);
  });

  it("needs the whole name, not a prefix of a longer word", () => {
    expect(resolveMentions("@Demonstration", members)).toEqual([]);
  });
});

describe("mentionQueryAt", () => {
  it("returns the partial name being typed after @", () => {
    expect(mentionQueryAt("hello @Dem", 10)).toEqual({ start: 6, query: "Dem" });
    expect(mentionQueryAt("hello @Demo An", 14)).toEqual({ start: 6, query: "Demo An" });
  });

  it("returns null outside a mention", () => {
    expect(mentionQueryAt("no mention here", 5)).toBeNull();
    expect(mentionQueryAt("a@b", 3)).toBeNull();
  });
});
