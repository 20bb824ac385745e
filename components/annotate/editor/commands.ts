import { translateGeometry } from "@/lib/geometry/transform-geometry";
import type { AnyShape } from "@/lib/markup/types";
import { withGeometry, withProperties, type Change, type ShapeMap } from "./model";
import { createShape, nextFreeName, type ShapeStamp } from "./shape-factory";
import type { DraftShape } from "./types";

/** How far a copy lands from its original: down and to the right on screen (y is up), in µm. */
export const DUPLICATE_OFFSET_UM: readonly [number, number] = [10, -10];

function existing(shapes: ShapeMap, ids: Iterable<string>): AnyShape[] {
  return [...ids].map((id) => shapes.get(id)).filter((s): s is AnyShape => s !== undefined);
}

/** Changes that delete the shapes. */
export function deletionChanges(shapes: ShapeMap, ids: Iterable<string>): Change[] {
  return existing(shapes, ids).map((before) => ({ before, after: null }));
}

/** Changes that move the shapes by (dx, dy) µm. */
export function moveChanges(shapes: ShapeMap, ids: Iterable<string>, dx: number, dy: number, now: string): Change[] {
  if (dx === 0 && dy === 0) return [];
  return existing(shapes, ids).map((before) => ({ before, after: withGeometry(before, translateGeometry(before.geometry, dx, dy), now) }));
}

/** The change that merges a patch into one shape's properties (none when the shape is gone). */
export function propertyChanges(shapes: ShapeMap, id: string, patch: Readonly<Record<string, unknown>>, now: string): Change[] {
  const before = shapes.get(id);
  return before ? [{ before, after: withProperties(before, patch, now) }] : [];
}

/**
 * Copies of the shapes, offset by DUPLICATE_OFFSET_UM. Pads get fresh labels (a pad table
 * needs them distinct); a copied wire bond stays on the copy of its pad when that pad is copied
 * too, and is otherwise left unattached (its foot is off the original pad's centre). The die
 * outline is not copied: a die has one.
 */
export function duplicateChanges(shapes: ShapeMap, ids: Iterable<string>, stamp: ShapeStamp): { changes: Change[]; ids: string[] } {
  const sources = existing(shapes, ids).filter((s) => s.kind !== "die_outline");
  const [dx, dy] = DUPLICATE_OFFSET_UM;
  const now = stamp.now();
  const labels = [...shapes.values()].flatMap((s) => (s.kind === "pad" ? [s.properties.label] : []));
  const copyOf = new Map<string, string>();
  const copies = sources.map((source) => {
    const copy = createShape({ kind: source.kind, geometry: translateGeometry(source.geometry, dx, dy), properties: source.properties } as DraftShape, stamp);
    copyOf.set(source.id, copy.id);
    return copy;
  });
  const finished = copies.map((copy) => {
    if (copy.kind === "pad") {
      const label = nextFreeName("P", labels);
      labels.push(label);
      // Only one pad is pad 1: a copy of it is an ordinary pad.
      return withProperties(copy, copy.properties.isPadOne ? { label, isPadOne: false } : { label }, now);
    }
    if (copy.kind === "wire_bond" && copy.properties.padId) {
      return withProperties(copy, { padId: copyOf.get(copy.properties.padId) ?? null }, now);
    }
    return copy;
  });
  return { changes: finished.map((after) => ({ before: null, after })), ids: finished.map((s) => s.id) };
}
