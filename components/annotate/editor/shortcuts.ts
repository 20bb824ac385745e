import type { KeyInput, ToolId } from "./types";

/** What a key asks the editor to do. */
export type KeyAction =
  | { readonly type: "tool"; readonly tool: ToolId }
  | { readonly type: "delete" }
  | { readonly type: "undo" }
  | { readonly type: "redo" }
  | { readonly type: "duplicate" }
  | { readonly type: "nudge"; readonly dx: number; readonly dy: number }
  | { readonly type: "cancel" }
  | { readonly type: "finish" }
  | { readonly type: "remove-last-point" }
  | { readonly type: "help" };

/** Nudge steps in µm: a plain arrow, and with Shift. */
const NUDGE_STEP_UM = 1;
const NUDGE_STEP_LARGE_UM = 10;

/**
 * One letter per tool, chosen from the tool's own name in our vocabulary (Pad, Wire bond,
 * Block, aXis, Trace, Ruler, Note, Outline, Select, Move the view).
 */
export const TOOL_KEYS: Readonly<Record<string, ToolId>> = {
  s: "select",
  m: "pan",
  p: "pad",
  w: "wire_bond",
  b: "block",
  x: "symmetry_axis",
  t: "trace",
  r: "ruler",
  n: "note",
  o: "die_outline",
};

/** The help sheet's rows, in the order shown. */
export const SHORTCUTS: readonly { readonly keys: readonly string[]; readonly description: string }[] = [
  { keys: ["S"], description: "Select, move and reshape markup" },
  { keys: ["M"], description: "Move around the die without selecting" },
  { keys: ["P"], description: "Draw a pad (drag a rectangle, or click for an 80 × 80 µm pad)" },
  { keys: ["W"], description: "Draw a wire bond (press on a pad and drag outward)" },
  { keys: ["B"], description: "Draw a block (click the corners; click the first one or press Enter to close)" },
  { keys: ["X"], description: "Draw the symmetry axis (two clicks; hold Shift to keep the existing one)" },
  { keys: ["T"], description: "Draw a trace along its centre line (Enter or double-click to finish)" },
  { keys: ["R"], description: "Measure with a ruler (Enter or double-click to finish)" },
  { keys: ["N"], description: "Place a note" },
  { keys: ["O"], description: "Draw the die outline (drag a rectangle; replaces the old one)" },
  { keys: ["Delete", "Backspace"], description: "Delete the selection (Backspace removes the last point while drawing)" },
  { keys: ["Ctrl+Z", "Cmd+Z"], description: "Undo" },
  { keys: ["Ctrl+Shift+Z", "Cmd+Shift+Z", "Ctrl+Y", "Cmd+Y"], description: "Redo" },
  { keys: ["Ctrl+D", "Cmd+D"], description: "Duplicate the selection" },
  {
    keys: ["L"],
    description:
      "Look for more like the selected pad or block on the shown micrograph: drag the score slider, click a candidate to drop or keep it, Add N creates them in one step (Escape cancels)",
  },
  { keys: ["Arrow keys"], description: "Nudge the selection by 1 µm (10 µm with Shift); ↑ is +y" },
  { keys: ["Alt+click"], description: "Add a vertex on an edge, or remove the vertex clicked" },
  {
    keys: ["Click again"],
    description:
      "At the same spot: select the next shape stacked there (a pad's wire bond, the block around it); Alt+click does the same where it edits no vertex",
  },
  { keys: ["Shift+click"], description: "Add to or remove from the selection" },
  { keys: ["Enter"], description: "Finish the block, trace or ruler being drawn" },
  { keys: ["Escape"], description: "Cancel the drawing or drag in progress; otherwise clear the selection" },
  { keys: ["F"], description: "Blink: in the overlay comparison, show the top micrograph alone, then the one below, in turn" },
  { keys: ["?"], description: "Show or hide this list" },
];

const ARROWS: Readonly<Record<string, readonly [number, number]>> = {
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
  // The die frame has y up, so the key pointing up on screen is +y.
  ArrowUp: [0, 1],
  ArrowDown: [0, -1],
};

function commandKey(k: KeyInput): KeyAction | null {
  const key = k.key.toLowerCase();
  if (key === "z") return { type: k.shift ? "redo" : "undo" };
  if (key === "y") return { type: "redo" };
  if (key === "d") return { type: "duplicate" };
  return null;
}

/**
 * The action for a key, or null when the editor does not use it (so the viewer or the browser
 * may). Arrows nudge only when something is selected, leaving them to pan the view otherwise;
 * Backspace removes the last vertex while drawing and Delete does nothing then.
 * @param context.drawing true while a shape is being drawn
 * @param context.hasSelection true when at least one shape is selected
 */
export function handleKey(k: KeyInput, context: { readonly drawing: boolean; readonly hasSelection: boolean }): KeyAction | null {
  if (k.ctrl || k.meta) return k.alt ? null : commandKey(k);
  if (k.key === "Escape") return { type: "cancel" };
  if (k.key === "Enter") return context.drawing ? { type: "finish" } : null;
  if (k.key === "Backspace" && context.drawing) return { type: "remove-last-point" };
  if (k.key === "Delete" || k.key === "Backspace") return context.drawing || !context.hasSelection ? null : { type: "delete" };
  const arrow = Object.hasOwn(ARROWS, k.key) ? ARROWS[k.key] : null;
  if (arrow) {
    if (!context.hasSelection || context.drawing || k.alt) return null;
    const step = k.shift ? NUDGE_STEP_LARGE_UM : NUDGE_STEP_UM;
    return { type: "nudge", dx: arrow[0] * step, dy: arrow[1] * step };
  }
  if (k.key === "?") return { type: "help" };
  if (k.alt) return null;
  const tool = Object.hasOwn(TOOL_KEYS, k.key.toLowerCase()) ? TOOL_KEYS[k.key.toLowerCase()] : undefined;
  return tool && k.key.length === 1 ? { type: "tool", tool } : null;
}
