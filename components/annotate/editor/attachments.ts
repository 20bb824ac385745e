import { polygonCentroid } from "@/lib/geometry/measure";
import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { withGeometry, type ShapeMap } from "./model";
import { axisAlignedBox } from "./rectangle";

/**
 * Where a wire bond starts on its pad: the pad's centre. A rectangle's centre is taken from its
 * box, exactly; other outlines use their centre of area.
 */
export function padCentre(geometry: PolygonGeometry): Position {
  const box = axisAlignedBox(geometry);
  return box ? [(box.minX + box.maxX) / 2, (box.minY + box.maxY) / 2] : polygonCentroid(geometry);
}

/** The pad a wire bond is attached to, when it exists. */
function bondPad(shapes: ShapeMap, bond: AnyShape): Extract<AnyShape, { kind: "pad" }> | null {
  if (bond.kind !== "wire_bond" || !bond.properties.padId) return null;
  const pad = shapes.get(bond.properties.padId);
  return pad && pad.kind === "pad" ? pad : null;
}

/**
 * Wire bonds that must change so that every attached bond still starts at its pad's centre,
 * after `changed` shapes were written into `shapes`: the bonds of every changed pad, and every
 * changed bond itself (moving a bond alone swings its free end; its foot stays on the pad).
 * Returns the updated bonds only; bonds already in place are left out.
 */
export function followingBonds(shapes: ShapeMap, changed: readonly AnyShape[], now: string): AnyShape[] {
  const pads = new Set(changed.filter((s) => s.kind === "pad").map((s) => s.id));
  const bonds = new Set(changed.filter((s) => s.kind === "wire_bond").map((s) => s.id));
  if (pads.size === 0 && bonds.size === 0) return [];
  const updated: AnyShape[] = [];
  for (const shape of shapes.values()) {
    if (shape.kind !== "wire_bond" || !shape.properties.padId) continue;
    if (!pads.has(shape.properties.padId) && !bonds.has(shape.id)) continue;
    const pad = bondPad(shapes, shape);
    if (!pad) continue;
    const centre = padCentre(pad.geometry);
    const [first, ...rest] = shape.geometry.coordinates;
    if (first && first[0] === centre[0] && first[1] === centre[1]) continue;
    updated.push(withGeometry(shape, { type: "LineString", coordinates: [centre, ...rest] }, now));
  }
  return updated;
}
