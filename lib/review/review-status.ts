/** Review states of a die and the actions that move it, as the schema's enums spell them. */
import type { ReviewAction, ReviewStatus } from "@/lib/dto/stored-values";

export type { ReviewAction, ReviewStatus };

const NEXT: Record<ReviewAction, Partial<Record<ReviewStatus, ReviewStatus>>> = {
  submit: { draft: "in_review", changes_requested: "in_review" },
  approve: { in_review: "approved" },
  request_changes: { in_review: "changes_requested" },
};

/** The status an action leads to from `from`, or null when the action is not allowed there. */
export function nextReviewStatus(from: ReviewStatus, action: ReviewAction): ReviewStatus | null {
  return NEXT[action][from] ?? null;
}

/** The right a review action needs from the role matrix: submitting is part of the work. */
export function rightFor(action: ReviewAction): "edit" | "decide" {
  return action === "submit" ? "edit" : "decide";
}

export const REVIEW_STATUS_LABELS: Record<ReviewStatus, string> = {
  draft: "Draft",
  in_review: "In review",
  approved: "Approved",
  changes_requested: "Changes requested",
};

/** A sentence saying why an action is refused in a status, for the 409 answer. */
export function transitionRefusal(from: ReviewStatus, action: ReviewAction): string {
  const verb = { submit: "submitted for review", approve: "approved", request_changes: "sent back for changes" }[action];
  return `A die that is ${REVIEW_STATUS_LABELS[from].toLowerCase()} cannot be ${verb}.`;
}
