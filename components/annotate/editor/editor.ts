import { deletionChanges, duplicateChanges, moveChanges, propertyChanges } from "./commands";
import { createShape } from "./shape-factory";
import { proposedDieOutline } from "./tools/die-outline";
import { createEditorCore, type EditorCore } from "./editor-core";
import { runKeyAction } from "./key-actions";
import { mergeEcho } from "./model";
import { handleKey } from "./shortcuts";
import type { Editor, EditorOptions } from "./types";

type Part<K extends keyof Editor> = Pick<Editor, K>;

/** Pointer and key input, routed to the current tool state. */
function inputPart(core: EditorCore, editor: () => Editor): Part<"pointerDown" | "pointerMove" | "pointerUp" | "doubleClick" | "keyDown"> {
  const { store, current } = core;
  const keyHost = {
    canEdit: core.canEdit,
    toolAllowed: core.toolAllowed,
    current,
    toggleHelp: () => store.update({ helpVisible: !store.get().helpVisible }),
  };
  return {
    pointerDown: (e) => store.batch(() => current().pointerDown?.(e)),
    pointerMove: (e) => store.batch(() => current().pointerMove?.(e)),
    pointerUp: (e) => store.batch(() => current().pointerUp?.(e)),
    doubleClick: (e) => store.batch(() => current().doubleClick?.(e)),
    keyDown(k) {
      const action = handleKey(k, { drawing: current().drawing === true, hasSelection: store.get().selection.size > 0 });
      return action ? store.batch(() => runKeyAction(editor(), action, keyHost)) : false;
    },
  };
}

/** Commands that change markup; each ends a drawing or drag in progress first. */
function editPart(
  core: EditorCore,
): Part<"deleteSelection" | "duplicateSelection" | "addShapes" | "proposeDieOutline" | "nudge" | "undo" | "redo" | "updateProperties"> {
  const { store, ctx, writer, shapes, stamp, canEdit, interrupt } = core;
  const editing = (run: () => void) =>
    store.batch(() => {
      if (!canEdit) return;
      interrupt();
      run();
    });
  const selection = () => store.get().selection;
  return {
    deleteSelection: () => editing(() => ctx.commit(deletionChanges(shapes(), selection()))),
    duplicateSelection: () =>
      editing(() => {
        const { changes, ids } = duplicateChanges(shapes(), selection(), stamp);
        ctx.commit(changes);
        if (ids.length > 0) ctx.setSelection(ids);
      }),
    addShapes: (drafts) =>
      editing(() => {
        if (drafts.length === 0) return;
        const created = drafts.map((d) => createShape(d, stamp));
        ctx.commit(created.map((after) => ({ before: null, after })));
        ctx.setSelection(created.map((s) => s.id));
      }),
    proposeDieOutline: (geometry) =>
      editing(() => {
        ctx.toIdle("die_outline");
        ctx.transition(proposedDieOutline(ctx, geometry));
      }),
    nudge: (dx, dy) => editing(() => ctx.commit(moveChanges(shapes(), selection(), dx, dy, stamp.now()))),
    undo: () =>
      store.batch(() => {
        // Undo in the middle of a drawing or drag takes back only that interaction.
        if (!canEdit || interrupt()) return;
        store.update({ notice: null });
        const entry = core.history.undo();
        if (entry) return writer.applyHistoryEntry(entry);
        const beyond = core.takeBeyond();
        if (beyond) {
          store.touch();
          beyond();
        }
      }),
    redo: () =>
      editing(() => {
        store.update({ notice: null });
        const entry = core.history.redo();
        if (entry) writer.applyHistoryEntry(entry);
      }),
    updateProperties: (id, patch) =>
      store.batch(() => {
        if (!canEdit) return;
        // The inspector may edit while a path is being drawn; only a live drag must end first,
        // or its history step would take in this edit.
        if (core.live()) interrupt();
        ctx.commit(propertyChanges(shapes(), id, patch, stamp.now()));
      }),
  };
}

/** Tool choice, selection, Escape and the help sheet: none of these records history. */
function viewPart(core: EditorCore): Part<"setTool" | "select" | "cancel" | "setHelpVisible" | "confirm" | "dismissNotice"> {
  const { store, ctx, interrupt } = core;
  return {
    setTool: (id) =>
      store.batch(() => {
        if (!core.toolAllowed(id)) return;
        interrupt();
        ctx.setHover(null);
        ctx.toIdle(id);
      }),
    select: (ids) => store.batch(() => ctx.setSelection(ids)),
    cancel: () =>
      store.batch(() => {
        if (interrupt()) return;
        if (store.get().helpVisible) store.update({ helpVisible: false });
        else ctx.setSelection([]);
      }),
    setHelpVisible: (visible) => store.batch(() => store.update({ helpVisible: visible })),
    confirm: () => store.batch(() => core.current().confirm?.()),
    dismissNotice: () => store.batch(() => store.update({ notice: null })),
  };
}

/** Server echoes: written into the model without history or commits. */
function serverPart(core: EditorCore): Part<"applyServerShape" | "removeServerShape"> {
  const { store, shapes, write } = core;
  return {
    applyServerShape: (shape, sent) =>
      store.batch(() => {
        const known = shapes().get(shape.id);
        // An echo older than what we hold (responses crossing) must not roll the shape back.
        if (known && known.version > shape.version) return;
        // Removed here after the request was sent: the removal is queued behind it, so do not bring it back.
        if (!known && sent) return;
        if (core.live()?.adopt(shape, sent)) return;
        write(new Map(shapes()).set(shape.id, mergeEcho(known, shape, sent)));
      }),
    removeServerShape: (id) =>
      store.batch(() => {
        if (core.live()?.touches(id)) core.interrupt();
        if (!shapes().has(id)) return;
        const next = new Map(shapes());
        next.delete(id);
        write(next);
      }),
  };
}

/**
 * Creates the markup editor: a model of shapes in die µm, a selection, the active tool's state
 * machine and an undo history of model diffs. Input arrives as pointer and key events already
 * in die µm; every committed change (user edits, undo, redo) goes to onCommit listeners as one
 * entry so the host can persist it. A read-only editor (canEdit false) selects and pans only
 * and never commits.
 */
export function createEditor(options: EditorOptions): Editor {
  const core = createEditorCore(options);
  const editor: Editor = {
    getState: () => core.store.snapshot(),
    subscribe: (listener) => core.store.subscribe(listener),
    onCommit(listener) {
      core.commitListeners.add(listener);
      return () => {
        core.commitListeners.delete(listener);
      };
    },
    ...inputPart(core, () => editor),
    ...editPart(core),
    ...viewPart(core),
    ...serverPart(core),
  };
  return editor;
}
