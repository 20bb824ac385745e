"use client";

import { useCallback, useMemo } from "react";
import { useSearchParams } from "next/navigation";
import { paramsWithWorkMode, workModeFromParams } from "./work-mode-url";
import type { WorkMode } from "./work-mode";

/** Sets the page's search params without a navigation; Next's router follows native history calls. */
export function writeSearchParams(params: URLSearchParams, push: boolean): void {
  const q = params.toString();
  const url = `${window.location.pathname}${q ? `?${q}` : ""}${window.location.hash}`;
  if (push) window.history.pushState(null, "", url);
  else window.history.replaceState(null, "", url);
}

const sessionOf = (w: WorkMode) => (w.kind === "align" ? `align:${w.movingId}:${w.fixedId}` : w.kind);

/**
 * The die bench's work mode, kept in the URL. Opening or leaving an alignment or a comparison
 * is a history step, so Back returns to the single view on the same die page (and Forward
 * brings the session back, clicked points included); switching the comparison's mode or
 * swapping its micrographs only replaces the entry.
 */
export function useWorkModeInUrl(): [WorkMode, (w: WorkMode) => void] {
  const params = useSearchParams();
  const key = params.toString();
  const work = useMemo(() => workModeFromParams(new URLSearchParams(key)), [key]);
  const setWork = useCallback((w: WorkMode) => {
    const now = new URLSearchParams(window.location.search);
    writeSearchParams(paramsWithWorkMode(now, w), sessionOf(workModeFromParams(now)) !== sessionOf(w));
  }, []);
  return [work, setWork];
}
