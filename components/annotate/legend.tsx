"use client";

import { MARKUP_KINDS, PAD_STATES, type MarkupKind } from "@/lib/markup/types";
import { KIND_STYLE, PAD_STATE_STYLE } from "./palette";

/** What each colour means, with a visibility toggle per kind. */
export function Legend({ hidden, onToggle, counts }: { hidden: ReadonlySet<MarkupKind>; onToggle: (k: MarkupKind) => void; counts: Partial<Record<MarkupKind, number>> }) {
  return (
    <section aria-label="Layers and legend" className="flex flex-col gap-1.5">
      <h2 className="text-sm font-semibold">Layers</h2>
      <ul className="flex flex-col gap-1 text-xs">
        {MARKUP_KINDS.map((k) => (
          <li key={k} className="flex items-center gap-2">
            <input id={`layer-${k}`} type="checkbox" checked={!hidden.has(k)} onChange={() => onToggle(k)} className="accent-kerf-500" />
            <span aria-hidden="true" className="inline-block h-2.5 w-5 rounded-sm" style={{ background: KIND_STYLE[k].colour, opacity: 0.9 }} />
            <label htmlFor={`layer-${k}`} className="flex-1 text-ink-200">
              {KIND_STYLE[k].label}
            </label>
            <span className="tabular-nums text-ink-400">{counts[k] ?? 0}</span>
          </li>
        ))}
      </ul>
      <p className="text-xs text-ink-400">Pads: {PAD_STATES.map((s) => PAD_STATE_STYLE[s].label).join(", ")}.</p>
    </section>
  );
}
