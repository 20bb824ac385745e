/** The markup editor's public surface for the React layer. */
export { createEditor } from "./editor";
export { handlesFor, handleAt, isRectangleKind, type Handle } from "./handles";
export { hitsAt, shapeAt } from "./hit-test";
export { handleKey, SHORTCUTS, TOOL_KEYS, NUDGE_STEP_UM, NUDGE_STEP_LARGE_UM, type KeyAction } from "./shortcuts";
export { DUPLICATE_OFFSET_UM } from "./commands";
export { DEFAULT_BOND_DIAMETER_UM, DEFAULT_PAD_SIZE_UM, DEFAULT_TRACE_WIDTH_UM } from "./shape-factory";
export type { Change } from "./model";
export {
  READ_ONLY_TOOLS,
  TOOL_IDS,
  type DraftShape,
  type Editor,
  type EditorOptions,
  type EditorState,
  type KeyInput,
  type PathKind,
  type PointerInput,
  type ToolId,
  type ToolPreview,
} from "./types";
