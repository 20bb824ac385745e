"use client";

import { MarkupTablePanel } from "@/components/annotate/markup-table-panel";
import { useDieWorkspace } from "../die-workspace-context";

/** Every shape of the die in one table, with its author. */
export function MarkupTab() {
  const { die, editor, state, markup, markupEditable, umPerPx } = useDieWorkspace();
  if (!editor || !state) return null;
  return (
    <MarkupTablePanel
      dieId={die.id}
      shapes={state.shapeList}
      authors={markup.authors}
      editor={editor}
      canEdit={markupEditable}
      onPick={markup.pick}
      umPerPx={umPerPx}
    />
  );
}
