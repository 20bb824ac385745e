"use client";

import { ExportPanel } from "@/components/export/export-panel";
import { useDieWorkspace } from "../die-workspace-context";

/** The hand-over exports of the die. */
export function ExportTab() {
  const { die, list, api, shown } = useDieWorkspace();
  return <ExportPanel die={die} micrographs={list} api={api} shownId={shown?.id} />;
}
