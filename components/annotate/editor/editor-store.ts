import type { AnyShape } from "@/lib/markup/types";
import type { ShapeMap } from "./model";
import type { ToolState } from "./tool-state";
import type { EditorState, ToolId, ToolPreview } from "./types";

/** The editor's mutable fields; each one is replaced, never changed in place. */
export type StoreFields = {
  readonly shapes: ShapeMap;
  readonly selection: ReadonlySet<string>;
  readonly activeTool: ToolId;
  readonly toolState: ToolState;
  readonly preview: ToolPreview | null;
  readonly hoverId: string | null;
  readonly helpVisible: boolean;
  readonly notice: string | null;
};

/** Fields of the snapshot that live outside the store (the history's undo and redo stacks). */
export type StoreExtras = () => { canEdit: boolean; canUndo: boolean; canRedo: boolean };

function sameSet(a: ReadonlySet<string>, b: ReadonlySet<string>): boolean {
  return a.size === b.size && [...a].every((id) => b.has(id));
}

/**
 * Holds the fields, builds one immutable snapshot per change and tells listeners once per
 * batch (one input event), however many fields the event changed.
 */
export function createStore(initial: StoreFields, extras: StoreExtras) {
  let fields = initial;
  let snapshot: EditorState | null = null;
  let list: { of: ShapeMap; shapes: readonly AnyShape[] } = { of: initial.shapes, shapes: [...initial.shapes.values()] };
  let depth = 0;
  let dirty = false;
  const listeners = new Set<() => void>();

  const touch = () => {
    snapshot = null;
    dirty = true;
  };
  const flush = () => {
    if (depth > 0 || !dirty) return;
    dirty = false;
    for (const listener of [...listeners]) listener();
  };

  return {
    get: () => fields,
    /** Replaces fields; a selection and hover that name missing shapes are cleaned up. */
    update(patch: Partial<StoreFields>) {
      let next = { ...fields, ...patch };
      if (patch.shapes || patch.selection) {
        const kept = new Set([...next.selection].filter((id) => next.shapes.has(id)));
        next = { ...next, selection: sameSet(kept, fields.selection) ? fields.selection : kept };
      }
      if (next.hoverId !== null && !next.shapes.has(next.hoverId)) next = { ...next, hoverId: null };
      const keys = Object.keys(next) as (keyof StoreFields)[];
      // Nothing changed (the same selection set again, say): keep the snapshot, tell no one.
      if (keys.every((k) => next[k] === fields[k])) return;
      fields = next;
      touch();
    },
    /** Marks the snapshot stale without a field change (the history moved). */
    touch,
    batch<T>(run: () => T): T {
      depth++;
      try {
        return run();
      } finally {
        depth--;
        flush();
      }
    },
    snapshot(): EditorState {
      if (snapshot) return snapshot;
      if (list.of !== fields.shapes) list = { of: fields.shapes, shapes: [...fields.shapes.values()] };
      const { canEdit, canUndo, canRedo } = extras();
      snapshot = {
        shapes: fields.shapes,
        shapeList: list.shapes,
        selection: fields.selection,
        activeTool: fields.activeTool,
        toolState: fields.toolState.name,
        drawing: fields.toolState.drawing === true,
        toolPreview: fields.preview,
        hoverId: fields.hoverId,
        canEdit,
        canUndo,
        canRedo,
        helpVisible: fields.helpVisible,
        notice: fields.notice,
        confirmation: fields.toolState.awaiting ?? null,
      };
      return snapshot;
    },
    subscribe(listener: () => void) {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
  };
}
