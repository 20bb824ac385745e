"use client";

import type { DieDto } from "@/lib/dto/dies";
import { useUnsavedGuard } from "@/components/ui/use-unsaved-guard";
import { ToolBar } from "@/components/annotate/tool-bar";
import { HelpSheet } from "@/components/annotate/help-sheet";
import { ReframeDialog } from "@/components/annotate/reframe-dialog";
import { DieWorkspaceProvider, useDieWorkspace } from "./die-workspace-context";
import { PanelResizer, useSidePanelWidth } from "./panel-resizer";
import { WorkArea } from "./work-area";
import { DiePanel } from "./die-panel";
import { UploadMicrographDialog } from "./upload-micrograph-dialog";

/**
 * The die view below its header (which the route's layout renders): the markup tool bar, the
 * work area and the resizable side panel, all reading one `DieWorkspaceProvider`.
 */
export function DieWorkspace({ initial, userId, linkedThreadId = null }: { initial: DieDto; userId: string; linkedThreadId?: string | null }) {
  return (
    <DieWorkspaceProvider initial={initial} userId={userId} linkedThreadId={linkedThreadId}>
      <WorkspaceBody />
    </DieWorkspaceProvider>
  );
}

function WorkspaceBody() {
  const { editor, state, save, dieSize, umPerPx, markupLock } = useDieWorkspace();
  const panel = useSidePanelWidth();
  // A shape half drawn, or markup edits still being saved, would be lost by a reload: ask first.
  useUnsavedGuard(!!state?.drawing || save.status === "saving");
  return (
    <>
      {editor && state && <ToolBar editor={editor} state={state} save={save} lockReason={markupLock} />}
      <div className="flex min-h-0 flex-1">
        <WorkArea />
        <PanelResizer width={panel.width} onResize={panel.resize} />
        <DiePanel width={panel.width} />
      </div>
      {editor && state && <HelpSheet open={state.helpVisible} onClose={() => editor.setHelpVisible(false)} />}
      {editor && state && <ReframeDialog editor={editor} state={state} die={dieSize} umPerPx={umPerPx} />}
      <UploadMicrographDialog />
    </>
  );
}
