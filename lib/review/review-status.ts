/**
 * A die's check and the actions that move it, in the words of engineering drawing checks
 * (drawn → checked → signed off; common practice), as the schema's enums spell them.
 */
import type { ReviewAction, ReviewStatus } from "@/lib/dto/stored-values";

export type { ReviewAction, ReviewStatus };

const NEXT: Record<ReviewAction, Partial<Record<ReviewStatus, ReviewStatus>>> = {
  send: { draft: "with_checker", returned: "with_checker" },
  withdraw: { with_checker: "draft" },
  sign_off: { with_checker: "signed_off" },
  return: { with_checker: "returned" },
};

/** The status an action leads to from `from`, or null when the action is not allowed there. */
export function nextReviewStatus(from: ReviewStatus, action: ReviewAction): ReviewStatus | null {
  return NEXT[action][from] ?? null;
}

/** The right a review action needs from the role matrix: sending and withdrawing are part of the drawing work. */
export function rightFor(action: ReviewAction): "edit" | "decide" {
  return action === "send" || action === "withdraw" ? "edit" : "decide";
}

/** Whether the die's markup is fixed in this status: while checked, and once signed off. */
export function markupLocked(status: ReviewStatus): boolean {
  return status === "with_checker" || status === "signed_off";
}

export const REVIEW_STATUS_LABELS: Record<ReviewStatus, string> = {
  draft: "Draft",
  with_checker: "With checker",
  signed_off: "Signed off",
  returned: "Returned with remarks",
};

/** The buttons' words for each action. */
export const REVIEW_ACTION_LABELS: Record<ReviewAction, string> = {
  send: "Send to checker",
  withdraw: "Withdraw",
  sign_off: "Sign off",
  return: "Return with remarks",
};

/** A past-tense phrase for each action, for history, inbox and mail ("sent NV-24R die A to the checker"). */
export function actionPhrase(action: ReviewAction, dieName: string): string {
  return {
    send: `sent ${dieName} to the checker`,
    withdraw: `withdrew ${dieName} from the checker`,
    sign_off: `signed off ${dieName}`,
    return: `returned ${dieName} with remarks`,
  }[action];
}

/** What happened to the die by each action, as a past participle ("signed off"): history, mail subjects, refusals. */
export const REVIEW_ACTION_DONE: Record<ReviewAction, string> = {
  send: "sent to the checker",
  withdraw: "withdrawn from the checker",
  sign_off: "signed off",
  return: "returned with remarks",
};

/** A sentence saying why an action is refused in a status, for the 409 answer. */
export function transitionRefusal(from: ReviewStatus, action: ReviewAction): string {
  return `A die that is ${REVIEW_STATUS_LABELS[from].toLowerCase()} cannot be ${REVIEW_ACTION_DONE[action]}.`;
}

/** Why the markup tools are off, for the 423 answer and the disabled tools. */
export function lockReason(status: ReviewStatus): string {
  return status === "with_checker"
    ? "The die is with the checker: its markup is fixed until it is returned or withdrawn."
    : "This revision is signed off: its markup is fixed. Open a new revision to change it.";
}
