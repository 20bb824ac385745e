import type { Geometry } from "@/lib/geometry/types";
import type { Change } from "@/lib/markup/history";
import type { AnyShape } from "@/lib/markup/types";
import { deepEqual } from "./deep-equal";

/**
 * One shape's change: created (before null), updated, or deleted (after null). A history entry,
 * and what onCommit delivers, is a list of these; the type is the history module's own.
 */
export type { Change };

export type ShapeMap = ReadonlyMap<string, AnyShape>;

/** The id a change is about. */
export function changeId(change: Change): string {
  const shape = change.after ?? change.before;
  if (!shape) throw new RangeError("a change needs a before or an after");
  return shape.id;
}

/** True when a change changes nothing (same data before and after). */
export function isNoOp(change: Change): boolean {
  return deepEqual(change.before, change.after);
}

/** A new map with the changes applied; the input map is left as it was. */
export function applyChanges(shapes: ShapeMap, changes: readonly Change[]): Map<string, AnyShape> {
  const next = new Map(shapes);
  for (const change of changes) {
    if (change.after) next.set(change.after.id, change.after);
    else next.delete(changeId(change));
  }
  return next;
}

/**
 * Folds changes to the same shape into one (the first before, the last after) and drops the
 * ones that end where they began, so an entry names each shape once.
 */
export function mergeChanges(changes: readonly Change[]): Change[] {
  const byId = new Map<string, Change>();
  for (const change of changes) {
    const id = changeId(change);
    const earlier = byId.get(id);
    byId.set(id, earlier ? { before: earlier.before, after: change.after } : change);
  }
  return [...byId.values()].filter((c) => !isNoOp(c));
}

/** The changes that turn `before` into the current map, for every id in `before`. */
export function changesSince(originals: ReadonlyMap<string, AnyShape | null>, current: ShapeMap): Change[] {
  return [...originals].map(([id, before]) => ({ before, after: current.get(id) ?? null })).filter((c) => !isNoOp(c));
}

/**
 * The shape with new geometry of the same type, stamped with the edit time; the shape itself
 * when the geometry is unchanged, so a drag back to where it began records nothing. The
 * geometry type of a kind never changes (a pad stays a Polygon), which makes the cast sound.
 */
export function withGeometry(shape: AnyShape, geometry: Geometry, now: string): AnyShape {
  if (geometry.type !== shape.geometry.type) throw new TypeError(`${shape.kind} needs ${shape.geometry.type} geometry`);
  if (deepEqual(geometry, shape.geometry)) return shape;
  return { ...shape, geometry, updatedAt: now } as AnyShape;
}

/** The shape with properties merged from a patch, stamped with the edit time (itself when nothing changes). */
export function withProperties(shape: AnyShape, patch: Readonly<Record<string, unknown>>, now: string): AnyShape {
  const properties = { ...shape.properties, ...patch };
  if (deepEqual(properties, shape.properties)) return shape;
  return { ...shape, properties, updatedAt: now } as AnyShape;
}

/**
 * What to keep of a server answer to a request that sent `sent`. When the local shape still
 * holds what was sent, the answer is taken whole. When it does not, the user edited the shape
 * again while the request was in flight and that newer edit is already queued behind it: only
 * what the server owns (version, author) is taken, or the answer would roll the edit back on
 * screen and the next edit would be built on the rolled-back properties (a PATCH replaces them
 * whole). Without `sent` (an answer not to our own request) the answer is taken whole.
 */
export function mergeEcho(local: AnyShape | null | undefined, answer: AnyShape, sent?: AnyShape | null): AnyShape {
  if (!local || !sent || (deepEqual(local.geometry, sent.geometry) && deepEqual(local.properties, sent.properties))) return answer;
  return { ...local, version: answer.version, createdBy: answer.createdBy } as AnyShape;
}
