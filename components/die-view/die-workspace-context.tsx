"use client";

import { createContext, useContext, useMemo, useState } from "react";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { can } from "@/lib/auth/permissions";
import type { ViewerApi } from "@/components/viewer";
import type { OverlayDrawer } from "@/components/annotate/markup-overlay";
import type { Editor, EditorState } from "@/components/annotate/editor/types";
import { useEditorState, useMarkupEditor, type SaveState } from "@/components/annotate/use-markup-editor";
import { useMarkupWorkspace } from "@/components/annotate/markup-workspace";
import { useSimilarSearch, type SimilarSearch } from "@/components/annotate/find-similar/use-similar-search";
import { useReviewBench, type ReviewBench } from "@/components/review/use-review-bench";
import { useSymmetryView, type SymmetryView } from "@/components/layout-reading/use-symmetry-view";
import { useWorkModeInUrl } from "@/components/compare/use-work-mode-url";
import type { WorkMode } from "@/components/compare/work-mode";
import { lockReason, markupLocked } from "@/lib/review/review-status";
import { useDie } from "./use-die";
import { useMicrographs } from "./use-micrographs";

/** Everything the die view's work area and side tabs share, read through `useDieWorkspace()`. */
export type DieWorkspace = {
  die: DieDto;
  userId: string;
  /** The caller's role may change the die, its micrographs and its markup. */
  editable: boolean;
  /** The caller may change the markup now: the role allows it and the die is not with the checker or signed off. */
  markupEditable: boolean;
  /** Why the markup is fixed for someone who could otherwise edit it, else null. */
  markupLock: string | null;
  dieSize: { widthUm: number | null; heightUm: number | null };
  /** The reference micrograph's scale: µm shown to people get the decimals it resolves. */
  umPerPx: number | null;
  micrographs: ReturnType<typeof useMicrographs>;
  list: MicrographDto[];
  /** The micrograph in the single view: the chosen one, else the reference one, else the first. */
  shown: MicrographDto | null;
  /** The shown micrograph's transform (image px → die µm), null until it is in the die frame. */
  shownTransform: Affine2x3 | null;
  /** Shows a micrograph picked from the list in the single view (leaving alignment or comparison). */
  pickMicrograph: (micrographId: string) => void;
  /** Makes a micrograph the shown one without leaving the work mode (a fresh upload). */
  setShownId: (micrographId: string) => void;
  work: WorkMode;
  setWork: (w: WorkMode) => void;
  /** The live viewer the markup draws on (the top one while comparing), null while none is. */
  api: ViewerApi | null;
  setApi: (api: ViewerApi | null) => void;
  editor: Editor | null;
  state: EditorState | null;
  save: SaveState;
  loadError: string | null;
  /** The shapes selected in the editor, in selection order. */
  selected: AnyShape[];
  markup: ReturnType<typeof useMarkupWorkspace>;
  symmetry: SymmetryView;
  review: ReviewBench;
  /** "Find similar" from the selected pad or block on the shown micrograph (single view only). */
  similar: SimilarSearch;
  /** What the overlay draws besides markup: the symmetry view, the review pins and found candidates. */
  drawers: OverlayDrawer[];
  uploadOpen: boolean;
  setUploadOpen: (open: boolean) => void;
};

const Context = createContext<DieWorkspace | null>(null);

/** The die view's shared state; only components inside `DieWorkspaceProvider` may call it. */
export function useDieWorkspace(): DieWorkspace {
  const ws = useContext(Context);
  if (!ws) throw new Error("useDieWorkspace outside DieWorkspaceProvider");
  return ws;
}

/** Owns the die view's state (micrographs, viewer, markup editor, review) and hands it to the tree below. */
export function DieWorkspaceProvider({
  initial,
  userId,
  linkedThreadId,
  children,
}: {
  initial: DieDto;
  userId: string;
  linkedThreadId: string | null;
  children: React.ReactNode;
}) {
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [uploadOpen, setUploadOpen] = useState(false);
  const micrographs = useMicrographs(initial.id);
  const list = useMemo(() => micrographs.data ?? [], [micrographs.data]);
  const shown = list.find((m) => m.id === selectedId) ?? list.find((m) => m.isReference) ?? list[0] ?? null;
  // Aligning or comparing replaces the single view; markup then edits on the top micrograph.
  const [work, setWork] = useWorkModeInUrl();
  const compareTop = work.kind === "compare" ? (list.find((m) => m.id === work.topId) ?? null) : null;
  const die = useDie(initial);
  const editable = can(die.yourRole, "edit");
  const markupLock = editable && markupLocked(die.reviewStatus) ? lockReason(die.reviewStatus) : null;
  const markupEditable = editable && !markupLock;
  const [viewerApi, setApi] = useState<ViewerApi | null>(null);
  // A viewer destroyed by a change of work area (single view ↔ alignment or comparison) until
  // the new one reports: never hand it on (OpenSeadragon clears its element on destroy).
  const api = viewerApi?.viewer.element ? viewerApi : null;
  const dieSize = useMemo(() => ({ widthUm: die.widthUm, heightUm: die.heightUm }), [die.widthUm, die.heightUm]);
  const { editor, save, loadError } = useMarkupEditor(die.id, markupEditable, userId, dieSize);
  const umPerPx = (list.find((m) => m.isReference) ?? shown)?.scaleUmPerPx ?? null;
  const state = useEditorState(editor);
  const shownTransform = shown?.transform ?? null;
  const markup = useMarkupWorkspace(editor, state, api, (compareTop ?? shown)?.transform ?? null, die.teamId, die.id);
  const symmetry = useSymmetryView(state?.shapeList);
  const review = useReviewBench(die.id, linkedThreadId, state, api, shownTransform, markup.pick);
  const single = work.kind === "view" ? shown : null;
  const similar = useSimilarSearch(editor, state, single?.id ?? null, single?.transform ?? null);
  const drawers = useMemo(
    () => [...symmetry.drawers, review.drawer, ...(similar.drawer ? [similar.drawer] : [])],
    [symmetry.drawers, review.drawer, similar.drawer],
  );
  const selected = useMemo(() => (state ? [...state.selection].map((id) => state.shapes.get(id)!).filter(Boolean) : []), [state]);
  const value: DieWorkspace = {
    die,
    userId,
    editable,
    markupEditable,
    markupLock,
    dieSize,
    umPerPx,
    micrographs,
    list,
    shown,
    shownTransform,
    pickMicrograph: (id) => {
      setSelectedId(id);
      setWork({ kind: "view" });
    },
    setShownId: setSelectedId,
    work,
    setWork,
    api,
    setApi,
    editor,
    state,
    save,
    loadError,
    selected,
    markup,
    symmetry,
    review,
    similar,
    drawers,
    uploadOpen,
    setUploadOpen,
  };
  return <Context.Provider value={value}>{children}</Context.Provider>;
}
