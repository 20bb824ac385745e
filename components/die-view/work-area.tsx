"use client";

import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { EditorNotice } from "@/components/annotate/reframe-dialog";
import { CompareWorkArea } from "@/components/compare/compare-work-area";
import { useDieWorkspace } from "./die-workspace-context";
import { ViewerPane } from "./viewer-pane";
import { WorkspaceOverlay } from "./workspace-overlay";
import { FrameOutlines } from "@/components/mosaics/frame-outlines";

/** The work area: the single view of the shown micrograph, or alignment and comparison, with markup on top. */
export function WorkArea() {
  const qc = useQueryClient();
  const { die, list, shown, work, setWork, api, setApi, editable, markupLock, editor, state, loadError } = useDieWorkspace();
  return (
    <section aria-label="Work area" className="relative min-w-0 flex-1 bg-ink-950">
      {work.kind !== "view" ? (
        <CompareWorkArea
          work={work}
          items={list}
          onWork={setWork}
          onAligned={() => qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) })}
          onTopViewer={setApi}
          overlay={(a, t) => <WorkspaceOverlay api={a} imageToDie={t} />}
        />
      ) : (
        <ViewerPane
          micrograph={shown}
          // The reference's scale places the die frame: fixed with the markup while checked or signed off.
          canEdit={editable && !(markupLock && shown?.isReference)}
          onViewer={setApi}
          overlay={api && shown?.transform ? <WorkspaceOverlay api={api} imageToDie={shown.transform} /> : null}
        />
      )}
      {work.kind === "view" && shown?.mosaic && shown.status === "ready" && <FrameOutlines key={shown.id} api={api} micrograph={shown} />}
      {work.kind === "view" && shown && !shown.transform && (
        <p role="status" className="absolute bottom-12 left-1/2 -translate-x-1/2 rounded bg-ink-900/95 px-3 py-1.5 text-xs text-ink-200">
          This micrograph is not in the die frame yet ({shown.scaleUmPerPx ? "align it to the reference" : "calibrate its scale"}); markup shows once it is.
        </p>
      )}
      {loadError && (
        <p role="alert" className="absolute left-3 top-3 text-sm text-danger-400">
          {loadError}
        </p>
      )}
      {editor && state && <EditorNotice editor={editor} state={state} />}
    </section>
  );
}
