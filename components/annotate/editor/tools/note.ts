import type { EditorContext, ToolState } from "../tool-state";
import { createAndSelect } from "./shared/create";

/** The note tool: a click places an empty note and selects it, so the inspector can take the text. */
export function noteIdle(ctx: EditorContext): ToolState {
  return {
    name: "note.idle",
    pointerDown(e) {
      createAndSelect(ctx, { kind: "note", geometry: { type: "Point", coordinates: [e.x, e.y] }, properties: { text: "" } });
    },
  };
}
