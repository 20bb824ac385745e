import type { AnyShape } from "./types";

/**
 * One shape's change: `before` null for a creation, `after` null for a deletion. History is
 * kept on these model diffs, never on canvas nodes, so undo works the same whatever draws it.
 */
export type Change = { readonly before: AnyShape | null; readonly after: AnyShape | null };

/** One undo step: the changes of one user action, in the order they were made. */
export type HistoryEntry = readonly Change[];

export type Direction = "forward" | "backward";

export type History = {
  /** Adds an applied entry as one undo step; clears redo. An entry without changes is ignored. */
  record(entry: HistoryEntry): void;
  /** Takes back the last step (ending any open interaction first): returns the entry to apply, already inverted, or null. */
  undo(): HistoryEntry | null;
  /** Makes the last undone step again: returns the entry to apply, or null. */
  redo(): HistoryEntry | null;
  canUndo(): boolean;
  canRedo(): boolean;
  /** Starts an interaction (a drag, a multi-click drawing): later bail() or commit() ends it. */
  mark(): void;
  /**
   * Cancels the interaction: returns the entry that takes the model back to the mark, drops
   * the steps recorded since, and leaves redo as it was when mark() was called.
   */
  bail(): HistoryEntry | null;
  /** Ends the interaction, merging its steps into one undo step. */
  commit(): void;
  /** Number of undo and redo steps held. */
  size(): { undo: number; redo: number };
};

/** The least number of steps a history keeps, whatever limit is asked for. */
const MIN_HISTORY_LIMIT = 100;

const changeId = (c: Change): string => (c.after ?? c.before)!.id;

/** The entry that undoes `entry`: its changes in reverse order, before and after swapped. */
export function invertEntry(entry: HistoryEntry): HistoryEntry {
  return [...entry].reverse().map((c) => ({ before: c.after, after: c.before }));
}

/**
 * Merges consecutive entries into one: per shape, the first `before` and the last `after`;
 * a shape created and deleted inside the run disappears from it.
 */
export function squashEntries(entries: readonly HistoryEntry[]): HistoryEntry {
  const merged = new Map<string, { before: AnyShape | null; after: AnyShape | null }>();
  for (const change of entries.flat()) {
    const id = changeId(change);
    const seen = merged.get(id);
    if (seen) seen.after = change.after;
    else merged.set(id, { before: change.before, after: change.after });
  }
  return [...merged.values()].filter((c) => c.before !== null || c.after !== null);
}

/**
 * Applies an entry to a model of shapes by id, without touching the input: forward sets each
 * change's `after` (deleting on null), backward applies the inverse entry.
 */
export function applyEntry(shapes: ReadonlyMap<string, AnyShape>, entry: HistoryEntry, direction: Direction): Map<string, AnyShape> {
  const out = new Map(shapes);
  const changes = direction === "forward" ? entry : invertEntry(entry);
  for (const change of changes) {
    if (change.before === null && change.after === null) continue;
    const id = changeId(change);
    if (change.after === null) out.delete(id);
    else out.set(id, change.after);
  }
  return out;
}

type Mark = { depth: number; redo: HistoryEntry[] };

/**
 * An undo/redo history of model diffs with interaction marks. Selection is not part of it:
 * selecting never records anything, so it never clears redo.
 * @param options.limit steps kept (oldest dropped first); at least 100, default 200
 */
export function createHistory(options: { limit?: number } = {}): History {
  const limit = Math.max(MIN_HISTORY_LIMIT, Math.floor(options.limit ?? 200));
  let undos: HistoryEntry[] = [];
  let redos: HistoryEntry[] = [];
  const marks: Mark[] = [];

  const push = (entry: HistoryEntry) => {
    undos.push(entry);
    const excess = undos.length - limit;
    if (excess > 0) {
      undos = undos.slice(excess);
      for (const m of marks) m.depth = Math.max(0, m.depth - excess);
    }
  };
  const commit = () => {
    const m = marks.pop();
    if (!m) return;
    const merged = squashEntries(undos.splice(m.depth));
    if (merged.length > 0) undos.push(merged);
  };
  // Undo or redo in the middle of an interaction first ends it, so the step taken back is whole.
  const endInteractions = () => {
    while (marks.length > 0) commit();
  };

  return {
    record(entry) {
      const changes = entry.filter((c) => c.before !== null || c.after !== null);
      if (changes.length === 0) return;
      push(changes);
      redos = [];
    },
    undo() {
      endInteractions();
      const entry = undos.pop();
      if (!entry) return null;
      redos.push(entry);
      return invertEntry(entry);
    },
    redo() {
      endInteractions();
      const entry = redos.pop();
      if (!entry) return null;
      push(entry);
      return entry;
    },
    canUndo: () => undos.length > 0,
    canRedo: () => redos.length > 0,
    mark() {
      marks.push({ depth: undos.length, redo: [...redos] });
    },
    bail() {
      const m = marks.pop();
      if (!m) return null;
      const since = undos.splice(m.depth);
      redos = m.redo;
      const back = invertEntry(squashEntries(since));
      return back.length > 0 ? back : null;
    },
    commit,
    size: () => ({ undo: undos.length, redo: redos.length }),
  };
}
