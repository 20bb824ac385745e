"use client";

import { MARKUP_KINDS, PAD_STATES, type MarkupKind } from "@/lib/markup/types";
import { KIND_STYLE, PAD_STATE_STYLE } from "./palette";
import { SHAPE_REVIEW_LABELS, SHAPE_REVIEW_STATES, type ShapeReviewState } from "@/lib/markup/review-state";

/** What each colour means, with a switch per kind saying whether it is shown ("layer" is kept for the die's process layers). */
export function Legend({
  hidden,
  onToggle,
  counts,
  hiddenReview,
  onToggleReview,
}: {
  hidden: ReadonlySet<MarkupKind>;
  onToggle: (k: MarkupKind) => void;
  counts: Partial<Record<MarkupKind, number>>;
  hiddenReview: ReadonlySet<ShapeReviewState>;
  onToggleReview: (s: ShapeReviewState) => void;
}) {
  return (
    <section aria-label="Shown on the die" className="flex flex-col gap-1.5">
      <h2 className="text-sm font-semibold">Shown</h2>
      <ul className="flex flex-col gap-1 text-xs">
        {MARKUP_KINDS.map((k) => (
          <li key={k} className="flex items-center gap-2">
            <input id={`shown-${k}`} type="checkbox" checked={!hidden.has(k)} onChange={() => onToggle(k)} className="accent-kerf-500" />
            <span aria-hidden="true" className="inline-block h-2.5 w-5 rounded-sm" style={{ background: KIND_STYLE[k].colour, opacity: 0.9 }} />
            <label htmlFor={`shown-${k}`} className="flex-1 text-ink-200">
              {KIND_STYLE[k].label}
            </label>
            <span className="tabular-nums text-ink-400">{counts[k] ?? 0}</span>
          </li>
        ))}
      </ul>
      <p className="text-xs text-ink-400">Pads: {PAD_STATES.map((s) => PAD_STATE_STYLE[s].label).join(", ")}.</p>
      <h3 className="mt-1 text-xs font-semibold text-ink-300">By remarks</h3>
      <ul className="flex flex-col gap-1 text-xs">
        {SHAPE_REVIEW_STATES.map((r) => (
          <li key={r} className="flex items-center gap-2">
            <input id={`shown-review-${r}`} type="checkbox" checked={!hiddenReview.has(r)} onChange={() => onToggleReview(r)} className="accent-kerf-500" />
            <label htmlFor={`shown-review-${r}`} className="text-ink-200">
              {SHAPE_REVIEW_LABELS[r]}
            </label>
          </li>
        ))}
      </ul>
    </section>
  );
}
