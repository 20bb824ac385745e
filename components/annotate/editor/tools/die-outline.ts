import type { EditorContext, ToolState } from "../tool-state";
import type { PolygonGeometry } from "@/lib/geometry/types";
import { awaitingConfirmation, rectangleToolIdle, type RectangleToolSpec } from "./shared/drawing-rectangle";

const DIE_OUTLINE: RectangleToolSpec = {
  tool: "die_outline",
  draft: (_ctx, geometry) => ({ kind: "die_outline", geometry, properties: {} }),
  // A die has one outline: drawing another replaces it.
  replaces: (ctx) => [...ctx.shapes().values()].filter((s) => s.kind === "die_outline"),
  clickGeometry: () => null,
  confirm: true,
};

/**
 * The die outline tool: drag a rectangle; a click makes nothing. The outline moves the die
 * frame's origin and sets the die's size, so it waits for confirmation (`Editor.confirm`).
 */
export function dieOutlineIdle(ctx: EditorContext): ToolState {
  return rectangleToolIdle(ctx, DIE_OUTLINE);
}

/** A die outline proposed from the image (detected edge), waiting for confirmation like a drawn one. */
export function proposedDieOutline(ctx: EditorContext, geometry: PolygonGeometry): ToolState {
  return awaitingConfirmation(ctx, DIE_OUTLINE, geometry);
}
