import { describe, it, expect } from "vitest";
import { applyEntry, createHistory, invertEntry, squashEntries, type HistoryEntry } from "./history";
import type { AnyShape } from "./types";

// The checks here are algebraic: undo must be the exact inverse of a step (applying a step and
// then its inverse gives back the model, value for value), and redo must give back the step.
const note = (id: string, x: number, text = "n"): AnyShape => ({
  id,
  kind: "note",
  geometry: { type: "Point", coordinates: [x, 0] },
  properties: { text },
  version: 1,
  createdBy: null,
  updatedAt: "2026-03-02T10:00:00.000Z",
});

type Model = Map<string, AnyShape>;
const model = (...shapes: AnyShape[]): Model => new Map(shapes.map((s) => [s.id, s]));
const snapshot = (m: Model) => [...m.entries()].sort(([a], [b]) => a.localeCompare(b));

/** A user action: applied to the model and recorded. */
function act(h: ReturnType<typeof createHistory>, m: Model, entry: HistoryEntry): Model {
  h.record(entry);
  return applyEntry(m, entry, "forward");
}

describe("applyEntry", () => {
  const start = model(note("a", 1), note("b", 2));
  const entry: HistoryEntry = [
    { before: null, after: note("c", 3) },
    { before: note("a", 1), after: note("a", 10, "moved") },
    { before: note("b", 2), after: null },
  ];

  it("creates, changes and deletes forward, and undoes all of it backward", () => {
    const after = applyEntry(start, entry, "forward");
    expect(snapshot(after)).toEqual(snapshot(model(note("a", 10, "moved"), note("c", 3))));
    expect(snapshot(applyEntry(after, entry, "backward"))).toEqual(snapshot(start));
  });

  it("leaves the model it is given untouched", () => {
    applyEntry(start, entry, "forward");
    expect(snapshot(start)).toEqual(snapshot(model(note("a", 1), note("b", 2))));
  });

  it("applies a change of the same shape twice in order, and inverts it in reverse order", () => {
    const twice: HistoryEntry = [
      { before: note("a", 1), after: note("a", 5) },
      { before: note("a", 5), after: note("a", 9) },
    ];
    expect(applyEntry(start, twice, "forward").get("a")).toEqual(note("a", 9));
    expect(invertEntry(twice)).toEqual([
      { before: note("a", 9), after: note("a", 5) },
      { before: note("a", 5), after: note("a", 1) },
    ]);
  });
});

describe("createHistory", () => {
  it("undoes and redoes 150 steps back to the very same models", () => {
    const h = createHistory();
    let m = model();
    const states = [snapshot(m)];
    for (let i = 0; i < 150; i++) {
      const id = `s${i % 7}`;
      const prev = m.get(id) ?? null;
      const next = i % 11 === 10 ? null : note(id, i);
      m = act(h, m, [{ before: prev, after: next }]);
      states.push(snapshot(m));
    }
    for (let i = 150; i > 0; i--) {
      m = applyEntry(m, h.undo()!, "forward");
      expect(snapshot(m)).toEqual(states[i - 1]);
    }
    expect(h.canUndo()).toBe(false);
    for (let i = 1; i <= 150; i++) {
      m = applyEntry(m, h.redo()!, "forward");
      expect(snapshot(m)).toEqual(states[i]);
    }
    expect(h.canRedo()).toBe(false);
  });

  it("keeps the last `limit` steps and never fewer than 100", () => {
    const h = createHistory({ limit: 10 });
    let m = model();
    for (let i = 0; i < 150; i++) m = act(h, m, [{ before: m.get("a") ?? null, after: note("a", i) }]);
    expect(h.size().undo).toBe(100);
    while (h.canUndo()) m = applyEntry(m, h.undo()!, "forward");
    expect(m.get("a")).toEqual(note("a", 49));
  });

  it("clears redo when a new step is recorded, but not for an empty one such as a selection change", () => {
    const h = createHistory();
    let m = act(h, model(), [{ before: null, after: note("a", 1) }]);
    m = act(h, m, [{ before: note("a", 1), after: note("a", 2) }]);
    m = applyEntry(m, h.undo()!, "forward");
    h.record([]);
    expect(h.canRedo()).toBe(true);
    m = act(h, m, [{ before: note("a", 1), after: note("a", 3) }]);
    expect(h.canRedo()).toBe(false);
    expect(m.get("a")).toEqual(note("a", 3));
  });

  it("bails back to the mark without touching redo", () => {
    const h = createHistory();
    let m = act(h, model(), [{ before: null, after: note("a", 1) }]);
    m = act(h, m, [{ before: note("a", 1), after: note("a", 2) }]);
    m = applyEntry(m, h.undo()!, "forward");
    const atMark = snapshot(m);
    h.mark();
    m = act(h, m, [{ before: null, after: note("b", 7) }]);
    m = act(h, m, [{ before: note("a", 1), after: note("a", 4) }]);
    m = act(h, m, [{ before: note("a", 4), after: note("a", 5) }]);
    m = applyEntry(m, h.bail()!, "forward");
    expect(snapshot(m)).toEqual(atMark);
    expect(h.size()).toEqual({ undo: 1, redo: 1 });
    m = applyEntry(m, h.redo()!, "forward");
    expect(m.get("a")).toEqual(note("a", 2));
  });

  it("merges an interaction into one undo step on commit", () => {
    const h = createHistory();
    let m = act(h, model(), [{ before: null, after: note("a", 0) }]);
    h.mark();
    for (let x = 1; x <= 5; x++) m = act(h, m, [{ before: m.get("a")!, after: note("a", x) }]);
    h.commit();
    expect(h.size().undo).toBe(2);
    m = applyEntry(m, h.undo()!, "forward");
    expect(m.get("a")).toEqual(note("a", 0));
  });

  it("ends an open interaction before undoing, so the whole interaction is taken back", () => {
    const h = createHistory();
    let m = act(h, model(), [{ before: null, after: note("a", 0) }]);
    h.mark();
    m = act(h, m, [{ before: note("a", 0), after: note("a", 1) }]);
    m = act(h, m, [{ before: note("a", 1), after: note("a", 2) }]);
    m = applyEntry(m, h.undo()!, "forward");
    expect(m.get("a")).toEqual(note("a", 0));
    expect(h.bail()).toBeNull();
  });

  it("answers null to undo, redo and bail when there is nothing to do", () => {
    const h = createHistory();
    expect([h.undo(), h.redo(), h.bail(), h.canUndo(), h.canRedo()]).toEqual([null, null, null, false, false]);
    h.mark();
    expect(h.bail()).toBeNull();
  });
});

describe("squashEntries", () => {
  it("keeps the first before and the last after of each shape and drops a shape created then deleted", () => {
    const merged = squashEntries([
      [{ before: null, after: note("t", 1) }],
      [{ before: note("a", 1), after: note("a", 2) }],
      [{ before: note("t", 1), after: null }],
      [{ before: note("a", 2), after: note("a", 3) }],
    ]);
    expect(merged).toEqual([{ before: note("a", 1), after: note("a", 3) }]);
  });
});
