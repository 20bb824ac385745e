import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ACTIVITY_VERBS, activityDetail, activitySentence } from "./activity-words";

/** Every audit action code written in server/: literal `action: "x.y"` and the review template's `review.${…}`. */
function serverActions(): string[] {
  const root = path.resolve(import.meta.dirname, "../../server");
  const files = (readdirSync(root, { recursive: true }) as string[]).filter((f) => f.endsWith(".ts") && !f.endsWith(".test.ts"));
  const codes = new Set<string>();
  for (const f of files) {
    const src = readFileSync(path.join(root, f), "utf8");
    if (!src.includes("recordAudit")) continue;
    for (const m of src.matchAll(/action: "([a-z_]+\.[a-z_]+)"/g)) codes.add(m[1]);
    for (const m of src.matchAll(/(?:\?|:) "([a-z_]+\.[a-z_]+)"/g)) codes.add(m[1]);
    if (src.includes("action: `review.${input.action}`")) for (const a of ["send", "withdraw", "sign_off", "return"]) codes.add(`review.${a}`);
  }
  return [...codes].sort();
}

describe("activity in words", () => {
  it("has a sentence for every audit action the server records", () => {
    const codes = serverActions();
    // The scan itself must find the known ones, or it proves nothing.
    expect(codes).toEqual(expect.arrayContaining(["micrograph.aligned", "thread.resolved", "thread.reopened", "review.sign_off", "comment.created"]));
    expect(codes.filter((c) => !(c in ACTIVITY_VERBS))).toEqual([]);
  });

  it("names the micrograph an alignment moved, with its illumination, model and control points", () => {
    const after = {
      transform: [
        [1, 0, 0],
        [0, -1, 0],
      ],
      controlPoints: [{}, {}, {}, {}],
      alignmentModel: "similarity",
      mirrored: false,
    };
    const detail = activityDetail("micrograph.aligned", {}, after, { micrograph: { label: "NV-24R 10x dark field", illumination: "dark_field" } });
    expect(activitySentence("micrograph.aligned", detail)).toBe(
      "aligned the dark-field micrograph “NV-24R 10x dark field” to the die frame (similarity, 4 control points)",
    );
    const ref = activityDetail("micrograph.reference_changed", {}, { referenceId: "x" }, { micrograph: { label: "NV-24R 5x", illumination: "dic" } });
    expect(activitySentence("micrograph.reference_changed", ref)).toBe("made the DIC micrograph “NV-24R 5x” the reference");
  });

  it("speaks of remarks and replies, with the remark's number and what was written", () => {
    const t = activityDetail("thread.resolved", {}, { status: "resolved" }, { remarkNumber: 3 });
    expect(activitySentence("thread.resolved", t)).toBe("closed remark 3");
    const first = activityDetail(
      "comment.created",
      null,
      { body: "Is pad 7 VB2?\nSee the dark field.", threadId: "t" },
      { remarkNumber: 3, isRemarkText: true },
    );
    expect(activitySentence("comment.created", first)).toBe("wrote remark 3: “Is pad 7 VB2?”");
    const reply = activityDetail("comment.created", null, { body: "Yes.", threadId: "t" }, { remarkNumber: 3, isRemarkText: false });
    expect(activitySentence("comment.created", reply)).toBe("wrote a reply on remark 3: “Yes.”");
    expect(activitySentence("comment.deleted", activityDetail("comment.deleted", { body: "x" }, null, { remarkNumber: 2 }))).toBe(
      "deleted a reply on remark 2",
    );
  });

  it("names the shape drawn, its kind in the legend's words and its label", () => {
    expect(activitySentence("markup.created", activityDetail("markup.created", null, { kind: "pad", properties: { label: "VB2" } }))).toBe("drew a pad “VB2”");
    expect(activitySentence("markup.deleted", activityDetail("markup.deleted", { kind: "wire_bond", properties: {} }, null))).toBe("deleted a wire bond");
    expect(activitySentence("markup.updated", activityDetail("markup.updated", null, { kind: "block", properties: { name: "LNA" } }))).toBe(
      "changed a block “LNA”",
    );
  });

  it("says which revision a sign-off froze, and when it went over open remarks", () => {
    const d = activityDetail("review.sign_off", {}, { reviewStatus: "signed_off", revision: 2, message: "Pad map checked.", overrideOpenRemarks: true });
    expect(activitySentence("review.sign_off", d)).toBe("signed off revision 2 of the die over open remarks: “Pad map checked.”");
    expect(activitySentence("review.return", activityDetail("review.return", {}, { message: "" }))).toBe("returned the die with remarks");
    expect(activitySentence("revision.opened", activityDetail("revision.opened", {}, { revision: 3 }))).toBe("opened revision 3");
  });

  it("reads an unknown code as words instead of showing it raw", () => {
    expect(activitySentence("probe.card_fitted", "")).toBe("probe card fitted");
  });
});
