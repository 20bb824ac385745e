import { shapeAt } from "../../hit-test";
import type { EditorContext, ToolState } from "../../tool-state";
import { pullingBond } from "./pulling";

const isPad = (s: { kind: string }) => s.kind === "pad";

/** The wire bond tool at rest: pads light up under the pointer; a press on a pad starts a bond. */
export function wireBondIdle(ctx: EditorContext): ToolState {
  return {
    name: "wire_bond.idle",
    pointerMove(e) {
      ctx.setHover(shapeAt(ctx.shapes().values(), [e.x, e.y], e.toleranceUm, isPad)?.id ?? null);
    },
    pointerDown(e) {
      const pad = shapeAt(ctx.shapes().values(), [e.x, e.y], e.toleranceUm, isPad);
      if (pad?.kind === "pad") ctx.transition(pullingBond(ctx, pad));
    },
  };
}
