"use client";

import type { Editor, EditorState, ToolId } from "./editor/types";
import { TOOL_KEYS } from "./editor/shortcuts";
import { KIND_STYLE } from "./palette";
import type { SaveState } from "./use-markup-editor";

const TOOL_LABELS: Record<ToolId, string> = {
  select: "Select",
  pan: "Move view",
  pad: "Pad",
  wire_bond: "Wire bond",
  block: "Block",
  symmetry_axis: "Symmetry axis",
  trace: "Trace",
  ruler: "Ruler",
  note: "Note",
  die_outline: "Die outline",
};
const KEY_OF = Object.fromEntries(Object.entries(TOOL_KEYS).map(([k, t]) => [t, k.toUpperCase()])) as Record<ToolId, string>;

function SaveIndicator({ save }: { save: SaveState }) {
  const text = { idle: "All changes saved", saving: "Saving…", saved: "Saved", failed: "Not saved" }[save.status];
  return (
    <span
      role="status"
      data-testid="save-state"
      data-status={save.status}
      className={`text-xs ${save.status === "failed" ? "text-danger-400" : "text-ink-400"}`}
      title={save.message}
    >
      {text}
      {save.status === "failed" && save.message ? `: ${save.message}` : ""}
    </span>
  );
}

/**
 * The markup tools across the top of the work area, with undo/redo, the save state and help.
 * While the die's markup is fixed (with the checker, signed off) the drawing tools stay in view,
 * disabled, with the reason beside them.
 */
export function ToolBar({ editor, state, save, lockReason }: { editor: Editor; state: EditorState; save: SaveState; lockReason: string | null }) {
  const tools = (state.canEdit || lockReason ? Object.keys(TOOL_LABELS) : ["select", "pan"]) as ToolId[];
  const off = (t: ToolId) => !state.canEdit && t !== "select" && t !== "pan";
  return (
    <div role="toolbar" aria-label="Markup tools" className="flex flex-wrap items-center gap-1 border-b border-ink-800 bg-ink-900 px-3 py-1.5">
      {tools.map((t) => {
        const colour = t in KIND_STYLE ? KIND_STYLE[t as keyof typeof KIND_STYLE].colour : undefined;
        return (
          <button
            key={t}
            type="button"
            aria-pressed={state.activeTool === t}
            disabled={off(t)}
            title={off(t) && lockReason ? lockReason : `${TOOL_LABELS[t]} (${KEY_OF[t]})`}
            onClick={() => editor.setTool(t)}
            className={`flex items-center gap-1.5 rounded px-2 py-1 text-xs disabled:cursor-not-allowed disabled:opacity-40 ${state.activeTool === t ? "bg-ink-700 text-ink-100" : "text-ink-300 hover:bg-ink-800"}`}
          >
            {colour && <span aria-hidden="true" className="h-2 w-2 rounded-full" style={{ background: colour }} />}
            {TOOL_LABELS[t]}
            <kbd className="text-[10px] text-ink-400">{KEY_OF[t]}</kbd>
          </button>
        );
      })}
      {state.canEdit && (
        <>
          <span className="mx-2 h-4 w-px bg-ink-700" aria-hidden="true" />
          <button
            type="button"
            onClick={() => editor.undo()}
            disabled={!state.canUndo}
            className="rounded px-2 py-1 text-xs text-ink-200 hover:bg-ink-800 disabled:text-ink-600"
          >
            Undo
          </button>
          <button
            type="button"
            onClick={() => editor.redo()}
            disabled={!state.canRedo}
            className="rounded px-2 py-1 text-xs text-ink-200 hover:bg-ink-800 disabled:text-ink-600"
          >
            Redo
          </button>
        </>
      )}
      {lockReason && (
        <p role="status" data-testid="markup-lock" className="ml-2 text-xs text-warn-300">
          {lockReason}
        </p>
      )}
      <span className="ml-auto flex items-center gap-3">
        {state.canEdit && <SaveIndicator save={save} />}
        <button type="button" onClick={() => editor.setHelpVisible(!state.helpVisible)} className="rounded px-2 py-1 text-xs text-ink-300 hover:bg-ink-800">
          Keyboard help (?)
        </button>
      </span>
    </div>
  );
}
