"use client";

import { Inspector } from "@/components/annotate/inspector";
import { Legend } from "@/components/annotate/legend";
import { FindSimilarAction } from "@/components/annotate/find-similar/find-similar-action";
import { useDieWorkspace } from "../die-workspace-context";

/** The Selection tab: the selected shapes' fields, what is shown (kinds and review states, with counts), and the labels switch. */
export function SelectionTab() {
  const { editor, state, selected, markupEditable, dieSize, umPerPx, markup, similar } = useDieWorkspace();
  return (
    <div className="flex flex-col gap-5">
      {editor && state ? (
        <>
          <Inspector editor={editor} selected={selected} canEdit={markupEditable} die={dieSize} umPerPx={umPerPx} />
          <FindSimilarAction similar={similar} />
        </>
      ) : (
        <p className="text-sm text-ink-400">Loading markup…</p>
      )}
      <Legend
        hidden={markup.hiddenKinds}
        onToggle={markup.toggleKind}
        counts={markup.counts}
        hiddenReview={markup.hiddenReview}
        onToggleReview={markup.toggleReview}
      />
      <label className="flex items-center gap-2 text-xs text-ink-300">
        <input type="checkbox" checked={markup.labels} onChange={(e) => markup.setLabels(e.target.checked)} className="accent-kerf-500" /> Show labels
      </label>
    </div>
  );
}
