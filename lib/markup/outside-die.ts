import { boundingBox, polygonCentroid } from "@/lib/geometry/measure";
import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import { dieFrameFromOutline, toOutlineAxes, type DieFrame } from "@/lib/pads/die-frame";
import type { AnyShape, MarkupKind } from "./types";

/**
 * Kinds that belong on the die and are flagged when drawn off it. Wire bonds, notes and rulers
 * leave the die by nature (a bond runs to the package, a note sits beside the die) and are not.
 */
const ON_DIE_KINDS: readonly MarkupKind[] = ["pad", "block", "trace"];

/** Slack at the edge, in µm: a pad drawn flush with the outline is on the die. */
const EDGE_SLACK_UM = 1e-6;

/** The die's frame for "outside" tests: its one drawn outline, else its recorded size, else null. */
export function dieFrameOf(shapes: Iterable<AnyShape>, die: { readonly widthUm: number | null; readonly heightUm: number | null } | null): DieFrame | null {
  const outlines = [...shapes].filter((s) => s.kind === "die_outline");
  try {
    if (outlines.length === 1) return dieFrameFromOutline(outlines[0].geometry as PolygonGeometry);
    if (outlines.length === 0 && die?.widthUm && die.heightUm) {
      const { widthUm: w, heightUm: h } = die;
      return dieFrameFromOutline({
        type: "Polygon",
        coordinates: [
          [
            [0, 0],
            [w, 0],
            [w, h],
            [0, h],
            [0, 0],
          ],
        ],
      });
    }
  } catch {
    // Not a rectangle: nothing can be said to be outside it.
  }
  return null;
}

/** A shape's centre: centre of area for polygons, of the bounding box for lines and points. */
function shapeCentre(shape: AnyShape): Position {
  if (shape.geometry.type === "Polygon") return polygonCentroid(shape.geometry);
  const b = boundingBox(shape.geometry);
  return [(b.minX + b.maxX) / 2, (b.minY + b.maxY) / 2];
}

/** Whether a point (die µm) lies outside the die frame's rectangle. */
function pointOutside(frame: DieFrame, p: Position): boolean {
  const [x, y] = toOutlineAxes(frame, p);
  return x < -EDGE_SLACK_UM || y < -EDGE_SLACK_UM || x > frame.widthUm + EDGE_SLACK_UM || y > frame.heightUm + EDGE_SLACK_UM;
}

/** True for a shape of a kind that belongs on the die whose centre lies outside the die. */
export function isOutsideDie(shape: AnyShape, frame: DieFrame | null): boolean {
  return frame !== null && ON_DIE_KINDS.includes(shape.kind) && pointOutside(frame, shapeCentre(shape));
}
