import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import type { Change, ShapeMap } from "./model";
import type { ShapeStamp } from "./shape-factory";
import type { PointerInput, ToolId, ToolPreview } from "./types";

/**
 * One state of a tool's state machine (idle, pointing, dragging, drawing …). The editor routes
 * input to the current state; a state moves on by `ctx.transition` or `ctx.toIdle`. Handlers a
 * state leaves out do nothing in that state.
 */
export interface ToolState {
  /** "<tool>.<state>", shown in EditorState.toolState. */
  readonly name: string;
  /** True while a shape is being drawn: Backspace removes a vertex, Enter finishes. */
  readonly drawing?: boolean;
  /** True while an interaction is under way that Escape (or switching tools) must undo. */
  readonly interacting?: boolean;
  pointerDown?(e: PointerInput): void;
  pointerMove?(e: PointerInput): void;
  pointerUp?(e: PointerInput): void;
  doubleClick?(e: PointerInput): void;
  /** Enter. */
  finish?(): void;
  /** Backspace while drawing. */
  removeLastPoint?(): void;
  /** Escape or a tool switch: put back whatever the interaction changed; the editor then goes idle. */
  cancel?(): void;
  /** A drawn die outline waiting for the user to confirm the re-framing it causes. */
  readonly awaiting?: { readonly kind: "die_outline"; readonly geometry: PolygonGeometry; readonly replaces: boolean };
  /** The user confirmed what `awaiting` asked. */
  confirm?(): void;
}

/**
 * Edits shown live while a pointer is down (a drag, a resize, a vertex drag): written into the
 * model at once, committed as one history entry on release or put back on cancel. Nothing
 * reaches the history until commit, so cancelling leaves undo and redo as they were.
 */
export interface LiveEdit {
  /** Writes the shapes now (bonds on moved pads follow), remembering how each was before. */
  set(shapes: readonly AnyShape[]): void;
  /** True when the edit has touched this shape. */
  touches(id: string): boolean;
  /** Records and delivers one entry from the states before the edit to the current ones. */
  commit(): readonly Change[];
  /** Puts every touched shape back. */
  cancel(): void;
}

/** What tool states may see and do. */
export interface EditorContext {
  readonly canEdit: boolean;
  readonly stamp: ShapeStamp;
  shapes(): ShapeMap;
  selection(): ReadonlySet<string>;
  setSelection(ids: Iterable<string>): void;
  setHover(id: string | null): void;
  setPreview(preview: ToolPreview | null): void;
  transition(state: ToolState): void;
  /** Makes `tool` the active tool (the current one when omitted) in its idle state. */
  toIdle(tool?: ToolId): void;
  /** Applies the changes (attached bonds follow), records one history entry and delivers it. */
  commit(changes: readonly Change[]): void;
  beginLiveEdit(): LiveEdit;
  /** Shows a short message to the user (a bond that changed its pad, a shape off the die). */
  notify(text: string): void;
  /** Where the last plain click on shapes landed, so a second click there can cycle the stack. */
  readonly clicks: { last: Position | null };
}
