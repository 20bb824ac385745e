import { DEFAULT_TRACE_WIDTH_UM } from "../shape-factory";
import type { EditorContext, ToolState } from "../tool-state";
import { createAndSelect } from "./shared/create";
import { pathToolIdle, type PathToolSpec } from "./shared/drawing-path";

const TRACE: PathToolSpec = {
  tool: "trace",
  kind: "trace",
  closed: false,
  minPoints: 2,
  maxPoints: null,
  complete(ctx, points) {
    createAndSelect(ctx, { kind: "trace", geometry: { type: "LineString", coordinates: points }, properties: { widthUm: DEFAULT_TRACE_WIDTH_UM } });
    return true;
  },
};

/** The trace tool: click along the centre line; Enter or a double click finishes. */
export function traceIdle(ctx: EditorContext): ToolState {
  return pathToolIdle(ctx, TRACE);
}
