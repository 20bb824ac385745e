const LABELS = { draft: "Draft", in_review: "In review", approved: "Approved", changes_requested: "Changes requested" } as const;
const STYLES = {
  draft: "bg-ink-800 text-ink-200",
  in_review: "bg-kerf-600/30 text-kerf-300",
  approved: "bg-ok-400/20 text-ok-400",
  changes_requested: "bg-danger-500/20 text-danger-400",
} as const;

/** The die's review status as a small label. */
export function ReviewBadge({ status }: { status: keyof typeof LABELS }) {
  return <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${STYLES[status]}`}>{LABELS[status]}</span>;
}
