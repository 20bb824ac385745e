import type { History } from "@/lib/markup/history";
import type { AnyShape } from "@/lib/markup/types";
import { followingBonds } from "./attachments";
import { applyChanges, changesSince, mergeEcho, type Change, type ShapeMap } from "./model";
import type { LiveEdit } from "./tool-state";

/** What a live edit needs from the editor. */
export type LiveEditHost = {
  readonly history: History;
  shapes(): ShapeMap;
  write(shapes: ShapeMap): void;
  now(): string;
  /** Hands a committed entry to the commit listeners. */
  deliver(entry: readonly Change[]): void;
  /** Called once when the edit is committed or cancelled. */
  ended(): void;
};

/** A live edit the editor can also tell about server echoes. */
export type EditorLiveEdit = LiveEdit & {
  /** Takes a server echo of a touched shape as its new starting point (its version); false when untouched. */
  adopt(shape: AnyShape, sent?: AnyShape | null): boolean;
};

/**
 * Starts a live edit. It opens a history mark so that the interaction is one step, records a
 * single entry on commit, and bails the mark on cancel (nothing was recorded in between, so
 * redo is as it was).
 */
export function startLiveEdit(host: LiveEditHost): EditorLiveEdit {
  const originals = new Map<string, AnyShape | null>();
  let open = true;
  host.history.mark();

  const remember = (shapes: ShapeMap, ids: Iterable<string>) => {
    for (const id of ids) if (!originals.has(id)) originals.set(id, shapes.get(id) ?? null);
  };
  const finish = () => {
    open = false;
    host.ended();
  };

  return {
    set(input) {
      if (!open) return;
      const current = host.shapes();
      remember(
        current,
        input.map((s) => s.id),
      );
      // The server owns versions: a live shape keeps the version of its starting point, which
      // a server echo during the edit may have moved on (adopt).
      const shapes = input.map((s) => {
        const start = originals.get(s.id);
        return start && start.version !== s.version ? ({ ...s, version: start.version } as AnyShape) : s;
      });
      let next = applyChanges(
        current,
        shapes.map((after) => ({ before: current.get(after.id) ?? null, after })),
      );
      const bonds = followingBonds(next, shapes, host.now());
      remember(
        next,
        bonds.map((b) => b.id),
      );
      next = applyChanges(
        next,
        bonds.map((after) => ({ before: null, after })),
      );
      host.write(next);
    },
    touches: (id) => originals.has(id),
    commit() {
      if (!open) return [];
      const entry = changesSince(originals, host.shapes());
      host.history.record(entry);
      host.history.commit();
      finish();
      if (entry.length > 0) host.deliver(entry);
      return entry;
    },
    cancel() {
      if (!open) return;
      const current = host.shapes();
      const back = [...originals].map(([id, before]) => ({ before: current.get(id) ?? null, after: before }));
      host.write(
        applyChanges(
          current,
          back.filter((c) => c.before !== null || c.after !== null),
        ),
      );
      host.history.bail();
      finish();
    },
    adopt(shape, sent) {
      if (!open || !originals.has(shape.id)) return false;
      // A starting point edited again after `sent` keeps that edit (a cancel must not drop it).
      originals.set(shape.id, mergeEcho(originals.get(shape.id), shape, sent));
      const live = host.shapes().get(shape.id);
      if (live) host.write(new Map(host.shapes()).set(shape.id, { ...live, version: shape.version } as AnyShape));
      return true;
    },
  };
}
