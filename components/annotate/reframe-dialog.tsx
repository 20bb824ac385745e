"use client";

import { dieFrameFromOutline } from "@/lib/pads/die-frame";
import { formatUm } from "@/lib/units/format-um";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import type { Editor, EditorState } from "./editor/types";

type DieSize = { readonly widthUm: number | null; readonly heightUm: number | null };

/** What re-framing from this outline does, in words, with µm rounded to what the scale resolves. */
function reframeEffect(outline: NonNullable<EditorState["confirmation"]>["geometry"], die: DieSize, umPerPx: number | null): { shift: string; size: string } {
  const f = dieFrameFromOutline(outline);
  const um = (v: number) => formatUm(v, umPerPx);
  const was = die.widthUm && die.heightUm ? ` (now ${um(die.widthUm)} × ${um(die.heightUm)} µm)` : " (not recorded yet)";
  return {
    shift: `The origin moves to the outline's lower-left corner: all markup, review anchors and micrograph placements shift by (${um(-f.origin[0])}, ${um(-f.origin[1])}) µm, so nothing moves against the image.`,
    size: `The die size becomes ${um(f.widthUm)} × ${um(f.heightUm)} µm${was}.`,
  };
}

/** Asks before a drawn die outline re-frames the die, saying what moves; Undo puts it back afterwards. */
export function ReframeDialog({ editor, state, die, umPerPx }: { editor: Editor; state: EditorState; die: DieSize; umPerPx: number | null }) {
  const pending = state.confirmation;
  let effect: { shift: string; size: string } | null = null;
  try {
    effect = pending ? reframeEffect(pending.geometry, die, umPerPx) : null;
  } catch {
    effect = null;
  }
  return (
    <Dialog
      open={pending !== null}
      onClose={() => {
        // Closing after Confirm fires too; only a dialog still waiting drops the outline.
        if (editor.getState().confirmation) editor.cancel();
      }}
      title="Set the die frame from this outline?"
    >
      {effect && (
        <div className="mb-4 flex flex-col gap-2 text-sm text-ink-200" data-testid="reframe-effect">
          <p>{effect.shift}</p>
          <p>{effect.size}</p>
          {pending?.replaces && <p>The die outline drawn before is replaced.</p>}
          <p className="text-ink-400">Undo (Ctrl+Z) puts the earlier frame back.</p>
        </div>
      )}
      <div className="flex justify-end gap-2">
        <Button onClick={() => editor.cancel()}>Cancel</Button>
        <Button variant="primary" onClick={() => editor.confirm()}>
          Set die frame
        </Button>
      </div>
    </Dialog>
  );
}

/** The editor's message about the last edit (a bond that changed its pad, a shape off the die). */
export function EditorNotice({ editor, state }: { editor: Editor; state: EditorState }) {
  if (!state.notice) return null;
  return (
    <div
      role="status"
      data-testid="editor-notice"
      className="absolute left-1/2 top-3 z-10 flex max-w-xl -translate-x-1/2 items-start gap-3 rounded border border-kerf-500/70 bg-ink-900/95 px-3 py-2 text-xs text-ink-100 shadow"
    >
      <span>{state.notice}</span>
      <button type="button" onClick={() => editor.dismissNotice()} className="shrink-0 text-ink-300 hover:text-ink-100" aria-label="Dismiss message">
        ✕
      </button>
    </div>
  );
}
