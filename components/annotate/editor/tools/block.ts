import { normaliseRing, ringArea } from "@/lib/geometry/measure";
import { newBlockProperties } from "../shape-factory";
import type { EditorContext, ToolState } from "../tool-state";
import { createAndSelect } from "./shared/create";
import { pathToolIdle, type PathToolSpec } from "./shared/drawing-path";

const BLOCK: PathToolSpec = {
  tool: "block",
  kind: "block",
  closed: true,
  minPoints: 3,
  maxPoints: null,
  complete(ctx, points) {
    const ring = normaliseRing(points, "ccw");
    // Three vertices on one line enclose nothing: keep drawing instead of making an empty block.
    if (ringArea(ring) === 0) return false;
    const properties = newBlockProperties(ctx.shapes().values());
    createAndSelect(ctx, { kind: "block", geometry: { type: "Polygon", coordinates: [ring] }, properties });
    return true;
  },
};

/** The block tool: click the corners; a click on the first corner or Enter closes it. */
export function blockIdle(ctx: EditorContext): ToolState {
  return pathToolIdle(ctx, BLOCK);
}
