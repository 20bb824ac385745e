import { REVIEW_STATUS_LABELS, type ReviewStatus } from "@/lib/review/review-status";

const STYLES: Record<ReviewStatus, string> = {
  draft: "bg-ink-800 text-ink-200",
  with_checker: "bg-kerf-600/30 text-kerf-300",
  signed_off: "bg-ok-400/20 text-ok-400",
  returned: "bg-danger-500/20 text-danger-400",
};

/** The die's check status as a small label. */
export function ReviewBadge({ status }: { status: ReviewStatus }) {
  return <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${STYLES[status]}`}>{REVIEW_STATUS_LABELS[status]}</span>;
}
