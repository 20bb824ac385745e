import type { EditorContext, ToolState } from "../tool-state";
import { createAndSelect } from "./shared/create";
import { pathToolIdle, type PathToolSpec } from "./shared/drawing-path";

const RULER: PathToolSpec = {
  tool: "ruler",
  kind: "ruler",
  closed: false,
  minPoints: 2,
  maxPoints: null,
  complete(ctx, points) {
    createAndSelect(ctx, { kind: "ruler", geometry: { type: "LineString", coordinates: points }, properties: {} });
    return true;
  },
};

/** The ruler: click along the path to measure (its length is in the preview); Enter or a double click keeps it. */
export function rulerIdle(ctx: EditorContext): ToolState {
  return pathToolIdle(ctx, RULER);
}
