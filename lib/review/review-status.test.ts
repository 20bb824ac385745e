import { describe, it, expect } from "vitest";
import { REVIEW_ACTIONS, REVIEW_STATUSES } from "@/lib/dto/stored-values";
import { markupLocked, nextReviewStatus, rightFor } from "./review-status";

// The check of a die as issue #15 spells it, after engineering drawing checks (drawn → checked
// → signed off; common practice): send draft/returned → with_checker, withdraw with_checker →
// draft, sign_off with_checker → signed_off, return with_checker → returned. Every other pair
// of action and state is refused. The table is written out here, not derived from the code.
const ALLOWED: Record<string, string> = {
  "send draft": "with_checker",
  "send returned": "with_checker",
  "withdraw with_checker": "draft",
  "sign_off with_checker": "signed_off",
  "return with_checker": "returned",
};

describe("nextReviewStatus", () => {
  for (const action of REVIEW_ACTIONS) {
    for (const from of REVIEW_STATUSES) {
      const expected = ALLOWED[`${action} ${from}`] ?? null;
      it(`${action} from ${from} → ${expected ?? "refused"}`, () => {
        expect(nextReviewStatus(from, action)).toBe(expected);
      });
    }
  }

  it("asks the edit right for sending and withdrawing and the decide right for decisions", () => {
    expect(rightFor("send")).toBe("edit");
    expect(rightFor("withdraw")).toBe("edit");
    expect(rightFor("sign_off")).toBe("decide");
    expect(rightFor("return")).toBe("decide");
  });

  it("fixes the markup while with the checker and once signed off", () => {
    expect(REVIEW_STATUSES.filter(markupLocked)).toEqual(["with_checker", "signed_off"]);
  });
});
