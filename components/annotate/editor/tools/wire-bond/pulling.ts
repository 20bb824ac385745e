import type { LineStringGeometry, Position } from "@/lib/geometry/types";
import type { Shape } from "@/lib/markup/types";
import { padCentre } from "../../attachments";
import { DEFAULT_BOND_DIAMETER_UM } from "../../shape-factory";
import type { EditorContext, ToolState } from "../../tool-state";
import type { DraftShape, PointerInput } from "../../types";
import { createAndSelect } from "../shared/create";

/**
 * Pulling a wire bond out of a pad: the line runs from the pad's centre to the pointer and is
 * created on release, attached to the pad. Released within the tolerance of the centre, it
 * makes nothing.
 */
export function pullingBond(ctx: EditorContext, pad: Shape<"pad">): ToolState {
  const centre = padCentre(pad.geometry);
  const draftTo = (e: PointerInput): DraftShape => {
    const geometry: LineStringGeometry = { type: "LineString", coordinates: [centre, [e.x, e.y] as Position] };
    return { kind: "wire_bond", geometry, properties: { diameterUm: DEFAULT_BOND_DIAMETER_UM, padId: pad.id } };
  };
  const farEnough = (e: PointerInput) => Math.hypot(e.x - centre[0], e.y - centre[1]) > e.toleranceUm;
  return {
    name: "wire_bond.pulling",
    drawing: true,
    interacting: true,
    pointerMove(e) {
      ctx.setPreview(farEnough(e) ? { type: "shape", shape: draftTo(e) } : null);
    },
    pointerUp(e) {
      ctx.setPreview(null);
      if (farEnough(e)) createAndSelect(ctx, draftTo(e));
      else ctx.toIdle("wire_bond");
    },
  };
}
