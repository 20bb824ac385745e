import { createHash } from "node:crypto";
import { describe, it, expect } from "vitest";
import { ifNoneMatchMatches, markupEtag } from "./etag";

const a = { id: "8f0c7d4e-1111-4aaa-8bbb-000000000001", version: 1, updatedAt: "2026-03-02T10:00:00.000Z" };
const b = { id: "8f0c7d4e-1111-4aaa-8bbb-000000000002", version: 4, updatedAt: "2026-03-02T10:05:00.000Z" };

describe("markupEtag", () => {
  it("is a quoted strong tag that does not depend on the order of the shapes", () => {
    const tag = markupEtag([a, b]);
    // RFC 9110 §8.8.3: entity-tag = [ weak ] opaque-tag, opaque-tag = DQUOTE *etagc DQUOTE.
    expect(tag).toMatch(/^"[\x21\x23-\x7e]+"$/);
    expect(markupEtag([b, a])).toBe(tag);
  });

  it("hashes the sorted id:version:updatedAt lines with SHA-256", () => {
    // Recomputed here with node:crypto's SHA-256 (FIPS 180-4) from the documented canonical text.
    const text = `2\n${[a, b]
      .map((s) => `${s.id}:${s.version}:${s.updatedAt}`)
      .sort()
      .join("\n")}`;
    const expected = createHash("sha256").update(text).digest("base64url").slice(0, 32);
    expect(markupEtag([a, b])).toBe(`"m-${expected}"`);
  });

  it("changes when a version changes, a shape is added or one is re-created under the same id", () => {
    const tag = markupEtag([a, b]);
    expect(markupEtag([a, { ...b, version: 5 }])).not.toBe(tag);
    expect(markupEtag([a])).not.toBe(tag);
    expect(markupEtag([a, { ...b, updatedAt: "2026-03-02T11:00:00.000Z" }])).not.toBe(tag);
    expect(markupEtag([])).not.toBe(markupEtag([a]));
  });
});

describe("ifNoneMatchMatches", () => {
  // RFC 9110 §8.8.3.2 weak comparison table: W/"1"~W/"1", W/"1"≁W/"2", W/"1"~"1", "1"~"1".
  it("uses weak comparison as RFC 9110 §13.1.2 requires for If-None-Match", () => {
    expect(ifNoneMatchMatches('W/"1"', 'W/"1"')).toBe(true);
    expect(ifNoneMatchMatches('W/"1"', 'W/"2"')).toBe(false);
    expect(ifNoneMatchMatches('W/"1"', '"1"')).toBe(true);
    expect(ifNoneMatchMatches('"1"', '"1"')).toBe(true);
  });

  it("accepts a list and the star, and nothing without a header", () => {
    // RFC 9110 §13.1.2 examples: If-None-Match: "xyzzy", "r2d2xxxx", "c3piozzzz" and If-None-Match: *.
    expect(ifNoneMatchMatches('"xyzzy", "r2d2xxxx", "c3piozzzz"', '"r2d2xxxx"')).toBe(true);
    expect(ifNoneMatchMatches('"xyzzy", W/"r2d2xxxx"', '"c3piozzzz"')).toBe(false);
    expect(ifNoneMatchMatches("*", '"anything"')).toBe(true);
    expect(ifNoneMatchMatches(null, '"1"')).toBe(false);
    expect(ifNoneMatchMatches("", '"1"')).toBe(false);
  });
});
