import { createHistory } from "@/lib/markup/history";
import { dieFrameOf, isOutsideDie } from "@/lib/markup/outside-die";
import { shapeLabel } from "@/lib/markup/markup-table";
import { KIND_STYLE } from "@/lib/markup/palette";
import { createStore } from "./editor-store";
import { startLiveEdit, type EditorLiveEdit } from "./live-edit";
import type { Change, ShapeMap } from "./model";
import { createModelWriter } from "./model-writer";
import type { ShapeStamp } from "./shape-factory";
import type { EditorContext, ToolState } from "./tool-state";
import { idleState } from "./tools";
import { READ_ONLY_TOOLS, type EditorOptions, type ToolId } from "./types";

/** The editor's insides, shared by the parts of its public API. */
export type EditorCore = ReturnType<typeof createEditorCore>;

/**
 * Builds the store, the history, the model writer and the context tool states work through.
 * The active tool starts as select, in its idle state.
 */
export function createEditorCore(options: EditorOptions) {
  const { canEdit } = options;
  const stamp: ShapeStamp = { newId: options.newId, now: options.now, userId: options.userId };
  const history = createHistory({ limit: options.historyLimit ?? 200 });
  const commitListeners = new Set<(entry: readonly Change[]) => void>();
  let live: EditorLiveEdit | null = null;
  let beyond: (() => void) | null = options.undoBeyondHistory ?? null;

  const placeholder: ToolState = { name: "select.idle" };
  const store = createStore(
    {
      shapes: new Map(options.shapes.map((s) => [s.id, s])),
      selection: new Set(),
      activeTool: "select",
      toolState: placeholder,
      preview: null,
      hoverId: null,
      helpVisible: false,
      notice: null,
    },
    () => ({ canEdit, canUndo: history.canUndo() || (canEdit && beyond !== null), canRedo: history.canRedo() }),
  );
  const shapes = () => store.get().shapes;
  const current = () => store.get().toolState;
  const write = (next: ShapeMap) => store.update({ shapes: next });
  const deliver = (entry: readonly Change[]) => {
    for (const listener of [...commitListeners]) listener(entry);
  };
  const toolAllowed = (tool: ToolId) => canEdit || READ_ONLY_TOOLS.includes(tool);
  const writer = createModelWriter({ canEdit, history, now: stamp.now, shapes, write, touch: store.touch, deliver });
  const notify = (text: string) => store.update({ notice: text });

  /** After a user edit: says so when a shape that belongs on the die has just left it (or was drawn off it). */
  const warnOffDie = (entry: readonly Change[]) => {
    const frame = dieFrameOf(shapes().values(), options.die ?? null);
    const off = entry.flatMap((c) => (c.after && isOutsideDie(c.after, frame) && !(c.before && isOutsideDie(c.before, frame)) ? [c.after] : []));
    if (off.length === 0) return;
    const first = off[0];
    const what = off.length === 1 ? `${KIND_STYLE[first.kind].label} ${shapeLabel(first)}`.trim() : `${off.length} shapes`;
    const pads = off.some((s) => s.kind === "pad") ? " Pads off the die are left out of the pad numbering unless you include them in the Selection tab." : "";
    notify(`${what} ${off.length === 1 ? "lies" : "lie"} outside the die outline.${pads}`);
  };

  const ctx: EditorContext = {
    canEdit,
    stamp,
    shapes,
    selection: () => store.get().selection,
    setSelection: (ids) => store.update({ selection: new Set(ids) }),
    setHover: (id) => store.update({ hoverId: id }),
    setPreview: (preview) => store.update({ preview }),
    transition: (state) => store.update({ toolState: state }),
    toIdle: (tool) => {
      const next = tool && toolAllowed(tool) ? tool : store.get().activeTool;
      store.update({ activeTool: next, toolState: idleState(next, ctx), preview: null });
    },
    commit: (changes) => {
      writer.commit(changes);
      warnOffDie(changes);
    },
    beginLiveEdit: () => {
      live?.cancel();
      const started = startLiveEdit({ history, shapes, write, now: stamp.now, deliver, ended: () => (live = live === edit ? null : live) });
      const edit: EditorLiveEdit = {
        ...started,
        commit() {
          const entry = started.commit();
          warnOffDie(entry);
          return entry;
        },
      };
      live = edit;
      return edit;
    },
    notify,
    clicks: { last: null },
  };
  store.update({ toolState: idleState("select", ctx) });

  /** Ends a drawing or drag in progress, putting back what it changed. True when there was one. */
  const interrupt = (): boolean => {
    const state = current();
    if (!state.interacting && !state.drawing) return false;
    state.cancel?.();
    live?.cancel();
    ctx.toIdle();
    return true;
  };

  /** Hands over the undo step beyond the history, once. */
  const takeBeyond = () => {
    const run = beyond;
    beyond = null;
    return run;
  };

  return { canEdit, stamp, history, store, ctx, writer, commitListeners, shapes, current, write, toolAllowed, interrupt, live: () => live, takeBeyond };
}
