"use client";

import { SymmetryPanel } from "@/components/layout-reading/symmetry-panel";
import { useDieWorkspace } from "../die-workspace-context";

/** The die's symmetry axis and the shapes mirrored across it. */
export function SymmetryTab() {
  const { state, symmetry, markup } = useDieWorkspace();
  if (!state) return null;
  return <SymmetryPanel view={symmetry} shapes={state.shapeList} onPick={markup.pick} />;
}
