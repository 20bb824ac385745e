import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import { dieFrameFromOutline } from "@/lib/pads/die-frame";
import type { Change } from "./editor/model";

/** What `POST /api/dies/{dieId}/frame/restore` needs to put an earlier die frame back. */
export type FrameUndo = {
  readonly originUm: Position;
  readonly widthUm: number | null;
  readonly heightUm: number | null;
  readonly outline: PolygonGeometry | null;
};

/**
 * The way back from a committed entry that re-frames the die (a die outline drawn or changed),
 * or null for any other entry. The server moves the origin to the new outline's lower-left
 * corner, so the earlier origin then lies at minus that corner; the earlier outline (the one the
 * entry removed or changed, in the earlier frame) and the die's size before the entry come back.
 */
export function frameUndoFor(entry: readonly Change[], die: { readonly widthUm: number | null; readonly heightUm: number | null }): FrameUndo | null {
  const drawn = entry.find((c) => c.after?.kind === "die_outline")?.after;
  if (!drawn || drawn.geometry.type !== "Polygon") return null;
  let origin: Position;
  try {
    origin = dieFrameFromOutline(drawn.geometry).origin;
  } catch {
    return null;
  }
  const earlier = entry.find((c) => c.before?.kind === "die_outline")?.before;
  return {
    originUm: [-origin[0], -origin[1]],
    widthUm: die.widthUm,
    heightUm: die.heightUm,
    outline: earlier && earlier.geometry.type === "Polygon" ? earlier.geometry : null,
  };
}
