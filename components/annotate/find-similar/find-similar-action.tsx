"use client";

import { Button } from "@/components/ui/button";
import type { SimilarSearch } from "./use-similar-search";

/** The Selection tab's action for one selected pad or block: search the shown micrograph for more like it (key L). */
export function FindSimilarAction({ similar }: { similar: SimilarSearch }) {
  if (!similar.canStart) return null;
  const busy = similar.session?.phase === "searching";
  return (
    <div className="flex items-center gap-2">
      <Button onClick={similar.start} disabled={busy} aria-keyshortcuts="L" title="Find similar (L)" className="whitespace-nowrap">
        Find similar
      </Button>
      <span className="text-xs text-ink-400">Looks for more like it on the shown micrograph.</span>
    </div>
  );
}
