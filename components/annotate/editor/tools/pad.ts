import { DEFAULT_PAD_SIZE_UM, newPadProperties } from "../shape-factory";
import { rectangleAround } from "../rectangle";
import type { EditorContext, ToolState } from "../tool-state";
import { rectangleToolIdle, type RectangleToolSpec } from "./shared/drawing-rectangle";

const PAD: RectangleToolSpec = {
  tool: "pad",
  draft: (ctx, geometry) => ({ kind: "pad", geometry, properties: newPadProperties(ctx.shapes().values()) }),
  replaces: () => [],
  clickGeometry: (p) => rectangleAround(p, DEFAULT_PAD_SIZE_UM, DEFAULT_PAD_SIZE_UM),
};

/** The pad tool: drag a rectangle, or click for a default square pad centred on the click. */
export function padIdle(ctx: EditorContext): ToolState {
  return rectangleToolIdle(ctx, PAD);
}
