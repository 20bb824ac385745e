"use client";

import { SideTabs } from "./side-tabs";
import { useDieWorkspace } from "./die-workspace-context";
import { SelectionTab } from "./tabs/selection-tab";
import { PadsTab } from "./tabs/pads-tab";
import { MarkupTab } from "./tabs/markup-tab";
import { EstimatesTab } from "./tabs/estimates-tab";
import { SymmetryTab } from "./tabs/symmetry-tab";
import { SummaryTab } from "./tabs/summary-tab";
import { ReviewTab } from "./tabs/review-tab";
import { ExportTab } from "./tabs/export-tab";
import { DieTab } from "./tabs/die-tab";

const TABS = [
  { id: "selection", label: "Selection", content: <SelectionTab /> },
  { id: "pads", label: "Pad table", content: <PadsTab /> },
  { id: "markup", label: "Markup", content: <MarkupTab /> },
  { id: "estimates", label: "Estimates", content: <EstimatesTab /> },
  { id: "symmetry", label: "Symmetry", content: <SymmetryTab /> },
  { id: "summary", label: "Summary", content: <SummaryTab /> },
  { id: "review", label: "Check & remarks", content: <ReviewTab /> },
  { id: "export", label: "Export", content: <ExportTab /> },
  { id: "die", label: "Die & micrographs", content: <DieTab /> },
];

/** The side panel beside the work area, as wide as the resizer left it; a deep link to a remark opens on Review. */
export function DiePanel({ width }: { width: number }) {
  const { review } = useDieWorkspace();
  return (
    <aside aria-label="Die panel" className="flex shrink-0 flex-col bg-ink-900" style={{ width }}>
      <SideTabs initial={review.linkedAtStart ? "review" : undefined} tabs={TABS} />
    </aside>
  );
}
