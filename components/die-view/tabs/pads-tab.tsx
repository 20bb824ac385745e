"use client";

import { PadTablePanel } from "@/components/annotate/pad-table-panel";
import { useDieWorkspace } from "../die-workspace-context";

const NONE: ReadonlySet<string> = new Set();

/** The die's pads as a table; a row picks its pad on the canvas. */
export function PadsTab() {
  const { die, state, markup, umPerPx } = useDieWorkspace();
  return <PadTablePanel dieId={die.id} selection={state?.selection ?? NONE} onPick={markup.pick} umPerPx={umPerPx} />;
}
