import type { BoundingBox } from "@/lib/geometry/measure";
import type { PolygonGeometry, Position } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { boxFromCorners, boxSize, rectangleGeometry } from "../../rectangle";
import type { EditorContext, ToolState } from "../../tool-state";
import type { DraftShape, PointerInput, ToolId } from "../../types";
import { createAndSelect } from "./create";

/** What makes one rectangle tool differ from another. */
export type RectangleToolSpec = {
  readonly tool: ToolId;
  /** The shape a rectangle makes. */
  draft(ctx: EditorContext, geometry: PolygonGeometry): DraftShape;
  /** Shapes the new one replaces in the same history entry. */
  replaces(ctx: EditorContext): readonly AnyShape[];
  /** The rectangle a click (or a drag smaller than the tolerance) makes, or null for none. */
  clickGeometry(p: Position): PolygonGeometry | null;
  /** The rectangle re-frames the die (a die outline): it waits for the user's confirmation. */
  readonly confirm?: boolean;
};

function bigEnough(box: BoundingBox, toleranceUm: number): boolean {
  const { width, height } = boxSize(box);
  return width >= toleranceUm && height >= toleranceUm;
}

/** A rectangle tool at rest: a press starts a rectangle. */
export function rectangleToolIdle(ctx: EditorContext, spec: RectangleToolSpec): ToolState {
  return {
    name: `${spec.tool}.idle`,
    pointerDown(e) {
      ctx.transition(drawingRectangle(ctx, spec, e));
    },
  };
}

/**
 * Dragging out an axis-aligned rectangle from the press point; the preview is the shape as it
 * will be created. A rectangle thinner than the tolerance either way counts as a click.
 */
function drawingRectangle(ctx: EditorContext, spec: RectangleToolSpec, down: PointerInput): ToolState {
  const boxTo = (e: PointerInput) => boxFromCorners([down.x, down.y], [e.x, e.y]);
  return {
    name: `${spec.tool}.drawing_rectangle`,
    drawing: true,
    interacting: true,
    pointerMove(e) {
      const box = boxTo(e);
      ctx.setPreview(bigEnough(box, e.toleranceUm) ? { type: "shape", shape: spec.draft(ctx, rectangleGeometry(box)) } : null);
    },
    pointerUp(e) {
      const box = boxTo(e);
      const geometry = bigEnough(box, e.toleranceUm) ? rectangleGeometry(box) : spec.clickGeometry([down.x, down.y]);
      ctx.setPreview(null);
      if (geometry && spec.confirm) ctx.transition(awaitingConfirmation(ctx, spec, geometry));
      else if (geometry) createAndSelect(ctx, spec.draft(ctx, geometry), spec.replaces(ctx));
      else ctx.toIdle(spec.tool);
    },
  };
}

/**
 * A drawn (or proposed) rectangle shown as it will be created, waiting for `confirm` (the host asks the user
 * and says what will move); Escape or a tool switch drops it and nothing is recorded.
 */
export function awaitingConfirmation(ctx: EditorContext, spec: RectangleToolSpec, geometry: PolygonGeometry): ToolState {
  const draft = spec.draft(ctx, geometry);
  ctx.setPreview({ type: "shape", shape: draft });
  return {
    name: `${spec.tool}.confirming`,
    interacting: true,
    awaiting: { kind: "die_outline", geometry, replaces: spec.replaces(ctx).length > 0 },
    confirm() {
      createAndSelect(ctx, draft, spec.replaces(ctx));
    },
    cancel() {
      ctx.setPreview(null);
    },
  };
}
