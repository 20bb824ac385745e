"use client";

import Link from "next/link";
import { InboxLink } from "@/components/account/inbox-link";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { DieDto } from "@/lib/dto/dies";
import { apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { Wordmark } from "@/components/ui/wordmark";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Dialog } from "@/components/ui/dialog";
import { ReviewBadge } from "@/components/ui/review-badge";
import { DieForm } from "@/components/workspace/die-form";
import { MicrographList } from "@/components/micrographs/micrograph-list";
import { UploadMicrograph } from "@/components/micrographs/upload-micrograph";
import { DieDetails } from "./die-details";
import { useMicrographs } from "./use-micrographs";
import { ViewerPane } from "./viewer-pane";
import { SideTabs } from "./side-tabs";
import { PanelResizer, useSidePanelWidth } from "./panel-resizer";
import { useUnsavedGuard } from "@/components/ui/use-unsaved-guard";
import type { ViewerApi } from "@/components/viewer";
import { MarkupOverlay } from "@/components/annotate/markup-overlay";
import { ToolBar } from "@/components/annotate/tool-bar";
import { Inspector } from "@/components/annotate/inspector";
import { Legend } from "@/components/annotate/legend";
import { HelpSheet } from "@/components/annotate/help-sheet";
import { PadTablePanel } from "@/components/annotate/pad-table-panel";
import { MarkupTablePanel } from "@/components/annotate/markup-table-panel";
import { useEditorState, useMarkupEditor } from "@/components/annotate/use-markup-editor";
import { EditorNotice, ReframeDialog } from "@/components/annotate/reframe-dialog";
import { useMarkupWorkspace } from "@/components/annotate/markup-workspace";
import { useReviewBench } from "@/components/review/use-review-bench";
import { ReviewPanel } from "@/components/review/review-panel";
import { EstimatesPanel } from "@/components/layout-reading/estimates-panel";
import { SymmetryPanel } from "@/components/layout-reading/symmetry-panel";
import { DieSummaryPanel } from "@/components/layout-reading/die-summary-panel";
import { ExportPanel } from "@/components/export/export-panel";
import { useSymmetryView } from "@/components/layout-reading/use-symmetry-view";
import { CompareWorkArea } from "@/components/compare/compare-work-area";
import { MicrographsManager } from "@/components/compare/micrographs-manager";
import { useWorkModeInUrl } from "@/components/compare/use-work-mode-url";

/** The die bench: a top bar with the die's identity, the work area, and a side panel. */
export function DieBench({ initial, userId, linkedThreadId = null }: { initial: DieDto; userId: string; linkedThreadId?: string | null }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [dialog, setDialog] = useState<null | "edit" | "delete" | "upload">(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const micrographs = useMicrographs(initial.id);
  const list = micrographs.data ?? [];
  // Show the chosen micrograph, else the reference one, else the first.
  const shown = list.find((m) => m.id === selectedId) ?? list.find((m) => m.isReference) ?? list[0] ?? null;
  // Aligning or comparing replaces the single view; markup then edits on the top micrograph.
  const [work, setWork] = useWorkModeInUrl();
  const compareTop = work.kind === "compare" ? (list.find((m) => m.id === work.topId) ?? null) : null;
  const die = useQuery({ queryKey: queryKeys.die(initial.id), queryFn: () => apiFetch<DieDto>(`/api/dies/${initial.id}`), initialData: initial }).data;
  const editable = can(die.yourRole, "edit");
  const [viewerApi, setApi] = useState<ViewerApi | null>(null);
  // A viewer destroyed by a change of work area (single view ↔ alignment or comparison) until
  // the new one reports: never hand it on (OpenSeadragon clears its element on destroy).
  const api = viewerApi?.viewer.element ? viewerApi : null;
  const dieSize = useMemo(() => ({ widthUm: die.widthUm, heightUm: die.heightUm }), [die.widthUm, die.heightUm]);
  const { editor, save, loadError } = useMarkupEditor(die.id, editable, userId, dieSize);
  // µm shown to people get the decimals the reference micrograph's scale resolves.
  const umPerPx = (list.find((m) => m.isReference) ?? shown)?.scaleUmPerPx ?? null;
  const state = useEditorState(editor);
  const ws = useMarkupWorkspace(editor, state, api, (compareTop ?? shown)?.transform ?? null, die.teamId, die.id);
  const symmetry = useSymmetryView(state?.shapeList);
  const review = useReviewBench(die.id, linkedThreadId, state, api, shown?.transform ?? null, ws.pick);
  const drawers = useMemo(() => [...symmetry.drawers, review.drawer], [symmetry.drawers, review.drawer]);
  const panel = useSidePanelWidth();
  // A shape half drawn, or markup edits still being saved, would be lost by a reload: ask first.
  useUnsavedGuard(!!state?.drawing || save.status === "saving");
  const update = useMutation({
    mutationFn: (body: unknown) => apiFetch<DieDto>(`/api/dies/${die.id}`, { method: "PATCH", body }),
    onSuccess: (d) => qc.setQueryData(queryKeys.die(die.id), d),
  });
  return (
    <>
      <header className="flex items-center gap-4 border-b border-ink-800 bg-ink-900 px-4 py-2">
        <Link href="/cases" aria-label="Kerfline home">
          <Wordmark />
        </Link>
        <nav aria-label="Breadcrumb" className="text-sm text-ink-400">
          <Link href="/cases" className="hover:text-ink-200">
            Cases
          </Link>{" "}
          /{" "}
          <Link href={`/cases/${die.caseId}`} className="hover:text-ink-200">
            {die.caseTitle}
          </Link>{" "}
          / <h1 className="inline text-sm font-semibold text-ink-100">{die.name}</h1>
        </nav>
        <ReviewBadge status={die.reviewStatus} />
        <div className="ml-auto flex items-center gap-2 text-sm">
          <InboxLink initialUnread={0} />
          {editable && (
            <>
              <Button onClick={() => setDialog("edit")}>Edit die</Button>
              <Button variant="danger" onClick={() => setDialog("delete")}>
                Delete die
              </Button>
            </>
          )}
        </div>
      </header>
      {editor && state && <ToolBar editor={editor} state={state} save={save} />}
      <div className="flex min-h-0 flex-1">
        <section aria-label="Work area" className="relative min-w-0 flex-1 bg-ink-950">
          {work.kind !== "view" ? (
            <CompareWorkArea
              work={work}
              items={list}
              onWork={setWork}
              onAligned={() => qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) })}
              onTopViewer={setApi}
              overlay={(a, t) =>
                editor && state ? (
                  <MarkupOverlay
                    api={a}
                    editor={editor}
                    state={state}
                    imageToDie={t}
                    hiddenKinds={ws.hiddenKinds}
                    labels={ws.labels}
                    extraDrawers={drawers}
                    isHidden={ws.isHidden}
                  />
                ) : null
              }
            />
          ) : (
            <ViewerPane
              micrograph={shown}
              canEdit={editable}
              onViewer={setApi}
              overlay={
                api && editor && state && shown?.transform ? (
                  <MarkupOverlay
                    api={api}
                    editor={editor}
                    state={state}
                    imageToDie={shown.transform}
                    hiddenKinds={ws.hiddenKinds}
                    labels={ws.labels}
                    extraDrawers={drawers}
                    isHidden={ws.isHidden}
                  />
                ) : null
              }
            />
          )}
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
        <PanelResizer width={panel.width} onResize={panel.resize} />
        <aside aria-label="Die panel" className="flex shrink-0 flex-col bg-ink-900" style={{ width: panel.width }}>
          <SideTabs
            initial={review.linkedAtStart ? "review" : undefined}
            tabs={[
              {
                id: "inspect",
                label: "Inspect",
                content: (
                  <div className="flex flex-col gap-5">
                    {editor && state ? (
                      <Inspector
                        editor={editor}
                        selected={[...state.selection].map((id) => state.shapes.get(id)!).filter(Boolean)}
                        canEdit={editable}
                        die={dieSize}
                        umPerPx={umPerPx}
                      />
                    ) : (
                      <p className="text-sm text-ink-400">Loading markup…</p>
                    )}
                    <Legend
                      hidden={ws.hiddenKinds}
                      onToggle={ws.toggleKind}
                      counts={ws.counts}
                      hiddenReview={ws.hiddenReview}
                      onToggleReview={ws.toggleReview}
                    />
                    <label className="flex items-center gap-2 text-xs text-ink-300">
                      <input type="checkbox" checked={ws.labels} onChange={(e) => ws.setLabels(e.target.checked)} className="accent-kerf-500" /> Show labels
                    </label>
                  </div>
                ),
              },
              {
                id: "pads",
                label: "Pad table",
                content: <PadTablePanel dieId={die.id} selection={state?.selection ?? new Set()} onPick={ws.pick} umPerPx={umPerPx} />,
              },
              {
                id: "markup",
                label: "Markup",
                content:
                  editor && state ? (
                    <MarkupTablePanel
                      dieId={die.id}
                      shapes={state.shapeList}
                      authors={ws.authors}
                      editor={editor}
                      canEdit={editable}
                      onPick={ws.pick}
                      umPerPx={umPerPx}
                    />
                  ) : null,
              },
              {
                id: "estimates",
                label: "Estimates",
                content:
                  editor && state ? (
                    <EstimatesPanel selected={[...state.selection].map((id) => state.shapes.get(id)!).filter(Boolean)} editor={editor} canEdit={editable} />
                  ) : null,
              },
              { id: "symmetry", label: "Symmetry", content: state ? <SymmetryPanel view={symmetry} shapes={state.shapeList} onPick={ws.pick} /> : null },
              {
                id: "summary",
                label: "Summary",
                content: state ? <DieSummaryPanel die={die} shapes={state.shapeList} onPick={ws.pick} umPerPx={umPerPx} /> : null,
              },
              {
                id: "review",
                label: "Review",
                content: <ReviewPanel die={die} userId={userId} review={review} state={state} api={api} transform={shown?.transform ?? null} />,
              },
              { id: "export", label: "Export", content: <ExportPanel die={die} micrographs={list} api={api} shownId={shown?.id} /> },
              {
                id: "die",
                label: "Die & micrographs",
                content: (
                  <div className="flex flex-col gap-5">
                    <DieDetails die={die} umPerPx={umPerPx} />
                    <section aria-label="Micrographs" className="flex flex-col gap-2">
                      <div className="flex items-center justify-between">
                        <h2 className="text-sm font-semibold">Micrographs</h2>
                        {editable && (
                          <Button variant="primary" onClick={() => setDialog("upload")}>
                            Upload micrograph
                          </Button>
                        )}
                      </div>
                      {micrographs.isPending ? (
                        <p className="text-sm text-ink-400">Loading…</p>
                      ) : (
                        <MicrographList
                          items={micrographs.data ?? []}
                          selectedId={shown?.id ?? null}
                          onSelect={(id) => {
                            setSelectedId(id);
                            setWork({ kind: "view" });
                          }}
                          onRetry={
                            editable
                              ? async (id) => {
                                  await apiFetch(`/api/micrographs/${id}/retry`, { method: "POST" });
                                  await qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) });
                                }
                              : undefined
                          }
                        />
                      )}
                    </section>
                    <MicrographsManager dieId={die.id} items={list} editable={editable} onWork={setWork} />
                  </div>
                ),
              },
            ]}
          />
        </aside>
      </div>
      {editor && state && <HelpSheet open={state.helpVisible} onClose={() => editor.setHelpVisible(false)} />}
      {editor && state && <ReframeDialog editor={editor} state={state} die={dieSize} umPerPx={umPerPx} />}
      <Dialog open={dialog === "upload"} onClose={() => setDialog(null)} title="Upload a micrograph">
        <UploadMicrograph
          dieId={die.id}
          onCancel={() => setDialog(null)}
          onUploaded={async (m) => {
            await qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) });
            setSelectedId(m.id);
            setDialog(null);
          }}
        />
      </Dialog>
      <Dialog open={dialog === "edit"} onClose={() => setDialog(null)} title="Edit die">
        <DieForm
          initial={die}
          submitLabel="Save"
          onCancel={() => setDialog(null)}
          onSubmit={async (v) => {
            await update.mutateAsync(v);
            setDialog(null);
          }}
        />
      </Dialog>
      <ConfirmDialog
        open={dialog === "delete"}
        title="Delete this die?"
        message={`“${die.name}” with its micrographs and markup will be deleted. This cannot be undone.`}
        confirmLabel="Delete die"
        onClose={() => setDialog(null)}
        onConfirm={async () => {
          await apiFetch(`/api/dies/${die.id}`, { method: "DELETE" });
          await qc.invalidateQueries({ queryKey: queryKeys.dies(die.caseId) });
          await qc.invalidateQueries({ queryKey: queryKeys.cases() });
          router.push(`/cases/${die.caseId}`);
        }}
      />
    </>
  );
}
