"use client";

import { useState } from "react";
import type { DieEdgeDto } from "@/lib/dto/find-similar";
import { apiFetch } from "@/lib/client/api";
import { outlineFromCorners } from "@/lib/similar-shapes/outline";
import { Button } from "@/components/ui/button";
import type { Editor, EditorState } from "../editor/types";

/**
 * On the die outline tool: "Detect edge" asks the server for an outline found in the shown
 * micrograph's edge structure and shows it (dashed, as a drawn one waiting) for the analyst to
 * accept in the re-framing dialog, which creates or replaces the die outline in one undoable
 * step, or to cancel.
 */
export function DetectEdge({ editor, state, micrographId }: { editor: Editor; state: EditorState; micrographId: string | null }) {
  const [busy, setBusy] = useState(false);
  const [note, setNote] = useState<{ text: string; error: boolean } | null>(null);
  if (state.activeTool !== "die_outline" || !state.canEdit || !micrographId) return null;
  const detect = async () => {
    setBusy(true);
    setNote(null);
    try {
      const edge = await apiFetch<DieEdgeDto>(`/api/micrographs/${micrographId}/detect-die-edge`, { method: "POST" });
      editor.proposeDieOutline(outlineFromCorners(edge.cornersUm));
      setNote({ text: `Proposed outline, confidence ${edge.confidence.toFixed(2)}: check it against the image before you set the die frame.`, error: false });
    } catch (e) {
      setNote({ text: (e as Error).message, error: true });
    } finally {
      setBusy(false);
    }
  };
  return (
    <section
      role="region"
      aria-label="Die edge"
      className="pointer-events-auto absolute left-1/2 top-2 z-30 flex w-[min(30rem,calc(100%-7rem))] -translate-x-1/2 flex-col gap-1.5 rounded-lg border border-ink-700 bg-ink-900/95 px-3 py-2 text-xs text-ink-100 shadow-lg"
    >
      <div className="flex items-center gap-3">
        <p className="flex-1">Drag a rectangle around the die, or let the edge be found in the image.</p>
        <Button onClick={detect} disabled={busy} className="whitespace-nowrap">
          {busy ? "Detecting…" : "Detect edge"}
        </Button>
      </div>
      {note && (
        <p role={note.error ? "alert" : "status"} className={note.error ? "text-danger-400" : "text-ink-300"}>
          {note.text}
        </p>
      )}
    </section>
  );
}
