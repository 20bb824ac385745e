import { describe, it, expect } from "vitest";
import { nextReviewStatus, rightFor } from "./review-status";

// The review flow of PRODUCT.md (flow 5): draft → in review → approved or changes requested,
// and back to in review after changes.
describe("nextReviewStatus", () => {
  it("follows the product's review flow", () => {
    expect(nextReviewStatus("draft", "submit")).toBe("in_review");
    expect(nextReviewStatus("in_review", "approve")).toBe("approved");
    expect(nextReviewStatus("in_review", "request_changes")).toBe("changes_requested");
    expect(nextReviewStatus("changes_requested", "submit")).toBe("in_review");
  });

  it("refuses every other move", () => {
    expect(nextReviewStatus("draft", "approve")).toBeNull();
    expect(nextReviewStatus("in_review", "submit")).toBeNull();
    expect(nextReviewStatus("approved", "submit")).toBeNull();
    expect(nextReviewStatus("approved", "request_changes")).toBeNull();
    expect(nextReviewStatus("changes_requested", "approve")).toBeNull();
  });

  it("asks the edit right for submitting and the decide right for decisions", () => {
    expect(rightFor("submit")).toBe("edit");
    expect(rightFor("approve")).toBe("decide");
    expect(rightFor("request_changes")).toBe("decide");
  });
});
