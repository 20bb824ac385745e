"use client";

import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import type { AnyShape } from "@/lib/markup/types";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { FindSimilarJobDto, SimilarCandidateDto } from "@/lib/dto/find-similar";
import { apiFetch } from "@/lib/client/api";
import { isTypingTarget } from "@/components/viewer/viewer-keys";
import type { OverlayDrawer } from "../markup-overlay";
import type { Editor, EditorState } from "../editor/types";
import { draftsFor, shownCandidates } from "./candidates";
import { drawCandidates } from "./candidate-drawer";

/** The server is asked for everything down to this score, so the slider can go below its start. */
const ASK_MIN_SCORE = 0.5;
/** Where the slider starts: the API's default threshold. */
const START_THRESHOLD = 0.7;
const POLL_MS = 400;

/** One "find similar" run: searching with progress, reviewing candidates, or failed. */
type Base = { token: number; template: AnyShape; micrographId: string };
type SimilarSession =
  | (Base & { phase: "searching"; progress: number })
  | (Base & { phase: "review"; candidates: SimilarCandidateDto[]; dropped: ReadonlySet<number>; threshold: number })
  | (Base & { phase: "failed"; message: string });

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Posts the search and follows it to its end: a 200 answer is the result itself, a 202 a job to poll. */
async function runSearch(micrographId: string, shapeId: string, live: () => boolean, onProgress: (p: number) => void): Promise<SimilarCandidateDto[] | null> {
  let job = await apiFetch<FindSimilarJobDto>(`/api/micrographs/${micrographId}/find-similar`, { method: "POST", body: { shapeId, minScore: ASK_MIN_SCORE } });
  while (job.status === "queued" || job.status === "running") {
    onProgress(job.progress);
    await sleep(POLL_MS);
    if (!live()) return null;
    job = await apiFetch<FindSimilarJobDto>(`/api/micrographs/${micrographId}/find-similar/${job.jobId}`);
  }
  if (job.status === "failed") throw new Error(job.error ?? "The search failed.");
  return job.candidates ?? [];
}

/**
 * "Find similar" on the shown micrograph: from the one selected pad or block, searches (with
 * progress), then shows the candidates for review on the overlay (a score slider filters
 * them, a click drops or keeps one) and adds the kept ones in one undoable step. Ends when
 * the template is no longer selected (Escape clears the selection), the micrograph changes or
 * shapes are added. The L key starts it.
 */
export function useSimilarSearch(editor: Editor | null, state: EditorState | null, micrographId: string | null, transform: Affine2x3 | null) {
  const [session, setSession] = useState<SimilarSession | null>(null);
  const tokens = useRef(0);
  // The running session's token, for the polling loop to notice a cancel.
  const activeToken = useRef(0);
  useEffect(() => {
    activeToken.current = session?.token ?? 0;
  }, [session]);
  const selected = state && state.selection.size === 1 ? (state.shapes.get([...state.selection][0]) ?? null) : null;
  const canStart = !!(editor && state?.canEdit && micrographId && transform && selected && (selected.kind === "pad" || selected.kind === "block"));

  // The session belongs to its template being selected on its micrograph (Escape clears the
  // selection): otherwise it ends, adjusted while rendering rather than in an effect.
  if (session && (!state?.selection.has(session.template.id) || session.micrographId !== micrographId)) setSession(null);

  const cancel = useCallback(() => setSession(null), []);

  const start = useCallback(() => {
    if (!canStart || !selected || !micrographId) return;
    const token = ++tokens.current;
    const base: Base = { token, template: selected, micrographId };
    // Answers of a session that was cancelled or replaced meanwhile change nothing.
    const apply = (next: SimilarSession) => setSession((s) => (s?.token === token ? next : s));
    setSession({ phase: "searching", ...base, progress: 0 });
    const live = () => activeToken.current === token;
    runSearch(micrographId, selected.id, live, (progress) => apply({ phase: "searching", ...base, progress })).then(
      (candidates) => candidates && apply({ phase: "review", ...base, candidates, dropped: new Set(), threshold: START_THRESHOLD }),
      (e: Error) => apply({ phase: "failed", ...base, message: e.message }),
    );
  }, [canStart, selected, micrographId]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key.toLowerCase() !== "l" || e.ctrlKey || e.metaKey || e.altKey || isTypingTarget(e.target) || document.querySelector("dialog[open]")) return;
      if (!canStart) return;
      e.preventDefault();
      start();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [canStart, start]);

  const review = session?.phase === "review" ? session : null;
  const shown = useMemo(() => (review ? shownCandidates(review.candidates, review.threshold) : []), [review]);
  const kept = useMemo(() => shown.filter(({ i }) => !review?.dropped.has(i)).map(({ c }) => c), [shown, review]);

  const toggle = useCallback((i: number) => {
    setSession((s) => {
      if (s?.phase !== "review") return s;
      const dropped = new Set(s.dropped);
      if (dropped.has(i)) dropped.delete(i);
      else dropped.add(i);
      return { ...s, dropped };
    });
  }, []);
  const setThreshold = useCallback((threshold: number) => setSession((s) => (s?.phase === "review" ? { ...s, threshold } : s)), []);

  const add = useCallback(() => {
    if (!editor || !review || kept.length === 0) return;
    const drafts = draftsFor(kept, review.template, editor.getState().shapes.values());
    setSession(null);
    editor.addShapes(drafts);
  }, [editor, review, kept]);

  const drawer: OverlayDrawer | null = useMemo(
    () => (review && review.micrographId === micrographId ? (ctx, m) => drawCandidates(ctx, m, shown, review.dropped) : null),
    [review, shown, micrographId],
  );

  return { session, canStart, start, cancel, toggle, setThreshold, add, shown, kept, drawer };
}

export type SimilarSearch = ReturnType<typeof useSimilarSearch>;
