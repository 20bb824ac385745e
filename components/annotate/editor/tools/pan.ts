import type { ToolState } from "../tool-state";

/** The pan tool does nothing itself: the viewer underneath pans and zooms. */
export function panIdle(): ToolState {
  return { name: "pan.idle" };
}
