import type { KeyAction } from "./shortcuts";
import type { ToolState } from "./tool-state";
import type { Editor, ToolId } from "./types";

/** What running a key's action needs beyond the public editor API. */
export type KeyActionHost = {
  readonly canEdit: boolean;
  toolAllowed(tool: ToolId): boolean;
  current(): ToolState;
  toggleHelp(): void;
};

/** Runs a key's action; false when it did not apply (so the browser may use the key). */
export function runKeyAction(editor: Editor, action: KeyAction, host: KeyActionHost): boolean {
  switch (action.type) {
    case "tool":
      editor.setTool(action.tool);
      return host.toolAllowed(action.tool);
    case "delete":
      editor.deleteSelection();
      return host.canEdit;
    case "undo":
      editor.undo();
      return host.canEdit;
    case "redo":
      editor.redo();
      return host.canEdit;
    case "duplicate":
      editor.duplicateSelection();
      return host.canEdit;
    case "nudge":
      editor.nudge(action.dx, action.dy);
      return host.canEdit;
    case "cancel":
      editor.cancel();
      return true;
    case "finish":
      host.current().finish?.();
      return true;
    case "remove-last-point":
      host.current().removeLastPoint?.();
      return true;
    case "help":
      host.toggleHelp();
      return true;
  }
}
