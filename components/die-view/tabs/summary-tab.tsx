"use client";

import { DieSummaryPanel } from "@/components/layout-reading/die-summary-panel";
import { useDieWorkspace } from "../die-workspace-context";

/** The die in one panel: size, pads, states and saved estimates. */
export function SummaryTab() {
  const { die, state, markup, umPerPx } = useDieWorkspace();
  if (!state) return null;
  return <DieSummaryPanel die={die} shapes={state.shapeList} onPick={markup.pick} umPerPx={umPerPx} />;
}
