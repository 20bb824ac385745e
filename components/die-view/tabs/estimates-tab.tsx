"use client";

import { EstimatesPanel } from "@/components/layout-reading/estimates-panel";
import { useDieWorkspace } from "../die-workspace-context";

/** Estimates on the selected shapes. */
export function EstimatesTab() {
  const { editor, state, selected, markupEditable } = useDieWorkspace();
  if (!editor || !state) return null;
  return <EstimatesPanel selected={selected} editor={editor} canEdit={markupEditable} />;
}
