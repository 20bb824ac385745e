import type { History } from "@/lib/markup/history";
import type { AnyShape } from "@/lib/markup/types";
import { followingBonds } from "./attachments";
import { applyChanges, changeId, isNoOp, mergeChanges, type Change, type ShapeMap } from "./model";

/** What the model writer needs from the editor. */
export type ModelWriterHost = {
  readonly canEdit: boolean;
  readonly history: History;
  now(): string;
  shapes(): ShapeMap;
  write(shapes: ShapeMap): void;
  /** Marks the snapshot stale when only the history moved. */
  touch(): void;
  deliver(entry: readonly Change[]): void;
};

/** The two ways the model changes with history: a user commit, and an undo or redo step. */
export function createModelWriter(host: ModelWriterHost) {
  return {
    /** Applies user changes with their attached bonds, records them as one step and delivers them. */
    commit(changes: readonly Change[]): void {
      if (!host.canEdit || changes.length === 0) return;
      let next = applyChanges(host.shapes(), changes);
      const afters = changes.flatMap((c) => (c.after ? [c.after] : []));
      const followers = followingBonds(next, afters, host.now()).map((after) => ({ before: next.get(after.id) ?? null, after }));
      next = applyChanges(next, followers);
      const entry = mergeChanges([...changes, ...followers]);
      if (entry.length === 0) return;
      host.write(next);
      host.history.record(entry);
      host.deliver(entry);
    },
    /**
     * Applies an undo or redo entry. The server owns `version`, so a shape that still exists
     * keeps the version last heard from the server; everything else returns exactly as it was.
     */
    applyHistoryEntry(entry: readonly Change[]): void {
      const model = host.shapes();
      const rebased = entry
        .map((c): Change => {
          const now = model.get(changeId(c)) ?? null;
          const after = c.after && now ? ({ ...c.after, version: now.version } as AnyShape) : c.after;
          return { before: now, after };
        })
        .filter((c) => !isNoOp(c));
      if (rebased.length === 0) return host.touch();
      host.write(applyChanges(model, rebased));
      host.deliver(rebased);
    },
  };
}
