import type { AnyShape } from "@/lib/markup/types";
import { createShape } from "../../shape-factory";
import type { EditorContext } from "../../tool-state";
import type { DraftShape } from "../../types";

/**
 * Creates a drawn shape (deleting `replacing` in the same history entry, for kinds a die has
 * one of), selects it and hands over to the select tool, so the inspector can edit it at once.
 */
export function createAndSelect(ctx: EditorContext, draft: DraftShape, replacing: readonly AnyShape[] = []): AnyShape {
  const shape = createShape(draft, ctx.stamp);
  ctx.setPreview(null);
  ctx.commit([...replacing.map((before) => ({ before, after: null })), { before: null, after: shape }]);
  ctx.setSelection([shape.id]);
  ctx.toIdle("select");
  return shape;
}
