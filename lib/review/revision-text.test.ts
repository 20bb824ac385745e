import { describe, expect, it } from "vitest";
import { revisionFileTag, revisionStatement } from "./revision-text";

// Wording written out by hand from issue #15 ("every export states the revision and whether it
// is signed off, by whom, when"); times cut from ISO 8601 to minutes, UTC.
describe("revision statement", () => {
  it("names signer and time of a signed-off revision", () => {
    const r = { number: 1, status: "signed_off", signedOffBy: "Demo Reviewer", signedOffAt: "2026-12-03T14:05:09.123Z" } as const;
    expect(revisionStatement(r)).toBe("Revision 1 · signed off by Demo Reviewer, 2026-12-03 14:05 UTC");
    expect(revisionFileTag(r)).toBe("rev 1 signed off 2026-12-03");
  });

  it("says plainly when a revision is not signed off", () => {
    const r = { number: 2, status: "with_checker", signedOffBy: null, signedOffAt: null } as const;
    expect(revisionStatement(r)).toBe("Revision 2 · with checker, not signed off");
    expect(revisionFileTag(r)).toBe("rev 2 with checker");
  });
});
