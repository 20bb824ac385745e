import type { BoundingBox } from "@/lib/geometry/measure";
import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import type { AnyShape, GeometryOf, MarkupKind, PropertiesOf } from "@/lib/markup/types";
import type { Change } from "./model";

/** The editor's tools: one per markup kind that can be drawn, plus selecting and panning. */
export const TOOL_IDS = ["select", "pan", "pad", "wire_bond", "block", "symmetry_axis", "trace", "ruler", "note", "die_outline"] as const;
export type ToolId = (typeof TOOL_IDS)[number];

/** Tools a read-only editor still offers: looking at the die is allowed, changing it is not. */
export const READ_ONLY_TOOLS: readonly ToolId[] = ["select", "pan"];

/**
 * One pointer event, already converted by the React layer: x and y in die µm (x right, y up),
 * and the hit tolerance in die µm (a few screen pixels times µm per screen pixel), so every
 * "close enough" test follows the zoom.
 */
export type PointerInput = {
  readonly x: number;
  readonly y: number;
  readonly toleranceUm: number;
  readonly shift: boolean;
  readonly alt: boolean;
};

/** One key press: `key` is KeyboardEvent.key ("a", "A", "Enter", "ArrowUp", "?", …). */
export type KeyInput = {
  readonly key: string;
  readonly shift: boolean;
  readonly ctrl: boolean;
  readonly meta: boolean;
  readonly alt: boolean;
};

/** A shape that is being drawn and has no id, version or author yet. */
export type DraftShape = {
  [K in MarkupKind]: { readonly kind: K; readonly geometry: GeometryOf[K]; readonly properties: PropertiesOf[K] };
}[MarkupKind];

/** Kinds drawn by clicking vertices one after another. */
export type PathKind = "block" | "trace" | "ruler" | "symmetry_axis";

/**
 * What the overlay draws for the interaction in progress:
 * - `shape`: a shape being dragged out (pad, die outline, wire bond) exactly as it would be created;
 * - `path`: the vertices placed so far plus the cursor, with the live length of that path (the
 *   ruler's reading) and whether a click now would close it (a block near its first vertex);
 * - `box`: the rectangle of a box selection.
 */
export type ToolPreview =
  | { readonly type: "shape"; readonly shape: DraftShape }
  | {
      readonly type: "path";
      readonly kind: PathKind;
      readonly points: readonly Position[];
      readonly cursor: Position | null;
      readonly lengthUm: number;
      readonly closesOnClick: boolean;
    }
  | { readonly type: "box"; readonly box: BoundingBox };

/** An immutable snapshot of the editor; a new object after every change, the same one otherwise. */
export type EditorState = {
  /** Every shape by id, in drawing order (later ones on top). */
  readonly shapes: ReadonlyMap<string, AnyShape>;
  /** The same shapes as an array in drawing order, for rendering. */
  readonly shapeList: readonly AnyShape[];
  readonly selection: ReadonlySet<string>;
  readonly activeTool: ToolId;
  /** The tool's current state, "<tool>.<state>" (e.g. "select.dragging"), for cursors and tests. */
  readonly toolState: string;
  /** True while a shape is being drawn (Backspace then removes a vertex, Enter finishes). */
  readonly drawing: boolean;
  readonly toolPreview: ToolPreview | null;
  /** The shape under the pointer when idle, for highlighting. */
  readonly hoverId: string | null;
  readonly canEdit: boolean;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
  /** Whether the keyboard help sheet is open ("?"). */
  readonly helpVisible: boolean;
  /** A message for the user about the last edit (a bond moved to another pad, a shape off the die), or null. */
  readonly notice: string | null;
  /**
   * A drawn die outline waiting for confirmation (it re-frames the die): its geometry and
   * whether it replaces the current outline. `confirm()` creates it, `cancel()` drops it.
   */
  readonly confirmation: { readonly kind: "die_outline"; readonly geometry: PolygonGeometry; readonly replaces: boolean } | null;
};

type Unsubscribe = () => void;

/** The editor: input events in, immutable snapshots and committed changes out. */
export interface Editor {
  getState(): EditorState;
  /** Called after every state change (fits React's useSyncExternalStore). */
  subscribe(listener: () => void): Unsubscribe;
  /** Called with every committed change (user edits, undo, redo) so it can be persisted. */
  onCommit(listener: (entry: readonly Change[]) => void): Unsubscribe;
  pointerDown(e: PointerInput): void;
  pointerMove(e: PointerInput): void;
  pointerUp(e: PointerInput): void;
  doubleClick(e: PointerInput): void;
  /** Returns true when the key was used, so the caller can prevent the browser's default. */
  keyDown(k: KeyInput): boolean;
  setTool(id: ToolId): void;
  deleteSelection(): void;
  duplicateSelection(): void;
  /** Creates the shapes in one history entry (one undo step) and selects them. */
  addShapes(drafts: readonly DraftShape[]): void;
  /** Shows a die outline proposed from the image, waiting for `confirm` as a drawn one does. */
  proposeDieOutline(geometry: PolygonGeometry): void;
  nudge(dx: number, dy: number): void;
  undo(): void;
  redo(): void;
  updateProperties(id: string, patch: Readonly<Record<string, unknown>>): void;
  select(ids: Iterable<string>): void;
  cancel(): void;
  setHelpVisible(visible: boolean): void;
  /** Goes ahead with what `confirmation` asks. */
  confirm(): void;
  dismissNotice(): void;
  /**
   * Writes a server answer in without history. `sent` is what our request sent: when the shape
   * has been edited again since, only the answer's version (and author) is taken.
   */
  applyServerShape(shape: AnyShape, sent?: AnyShape | null): void;
  removeServerShape(id: string): void;
}

/** What createEditor needs from its host. */
export type EditorOptions = {
  readonly shapes: readonly AnyShape[];
  readonly canEdit: boolean;
  readonly newId: () => string;
  readonly now: () => string;
  readonly userId: string | null;
  /** Undo steps kept (default 200). */
  readonly historyLimit?: number;
  /** The die's recorded size, for "outside the die" when no outline is drawn. */
  readonly die?: { readonly widthUm: number | null; readonly heightUm: number | null } | null;
  /**
   * One undo step that lives outside this editor's history: taken (once) when the history has
   * nothing left to undo. The host uses it to restore the die frame after a re-framing reloaded
   * the editor.
   */
  readonly undoBeyondHistory?: () => void;
};
