"use client";

import { useCallback, useEffect, useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { applyAffine, invertAffine } from "@/lib/geometry/affine";
import { boundingBox } from "@/lib/geometry/measure";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { AnyShape, MarkupKind } from "@/lib/markup/types";
import { reviewStates, type ShapeReviewState } from "@/lib/markup/review-state";
import type { MemberDto } from "@/lib/dto/teams";
import { apiFetch } from "@/lib/client/api";
import type { ViewerApi } from "@/components/viewer";
import type { Editor, EditorState } from "./editor/types";
import { isTypingTarget } from "@/components/viewer/viewer-keys";
import { useThreadList } from "@/components/review/use-threads";

/** Shared state of the markup workspace: visibility, labels, picking (select + fly to). */
export function useMarkupWorkspace(
  editor: Editor | null,
  state: EditorState | null,
  api: ViewerApi | null,
  transform: Affine2x3 | null,
  teamId: string,
  dieId: string,
) {
  const [hiddenKinds, setHidden] = useState<ReadonlySet<MarkupKind>>(new Set());
  const [labels, setLabels] = useState(true);
  const [hiddenReview, setHiddenReview] = useState<ReadonlySet<ShapeReviewState>>(new Set());
  const threads = useThreadList(dieId);
  const states = useMemo(() => reviewStates(threads.data ?? []), [threads.data]);
  const isHidden = useCallback((s: AnyShape) => hiddenReview.size > 0 && hiddenReview.has(states.get(s.id) ?? "none"), [hiddenReview, states]);
  const toggleReview = useCallback((r: ShapeReviewState) => {
    setHiddenReview((h) => {
      const next = new Set(h);
      if (next.has(r)) next.delete(r);
      else next.add(r);
      return next;
    });
  }, []);
  const members = useQuery({ queryKey: queryKeys.members(teamId), queryFn: () => apiFetch<MemberDto[]>(`/api/teams/${teamId}/members`) });
  const authors = useMemo(() => Object.fromEntries((members.data ?? []).map((m) => [m.userId, m.name])), [members.data]);

  const toggleKind = useCallback((k: MarkupKind) => {
    setHidden((h) => {
      const next = new Set(h);
      if (next.has(k)) next.delete(k);
      else next.add(k);
      return next;
    });
  }, []);

  /** Selects a shape and flies the viewer to it (with some room around it). */
  const pick = useCallback(
    (id: string) => {
      if (!editor) return;
      editor.select([id]);
      const s = editor.getState().shapes.get(id);
      if (!s || !api || !transform) return;
      const b = boundingBox(s.geometry);
      const inv = invertAffine(transform);
      const pts = [applyAffine(inv, b.minX, b.minY), applyAffine(inv, b.maxX, b.maxY)];
      const x0 = Math.min(pts[0][0], pts[1][0]);
      const y0 = Math.min(pts[0][1], pts[1][1]);
      const w = Math.abs(pts[1][0] - pts[0][0]);
      const h = Math.abs(pts[1][1] - pts[0][1]);
      const pad = Math.max(w, h, 40) * 2;
      api.flyToImageRect(x0 - pad, y0 - pad, w + 2 * pad, h + 2 * pad);
    },
    [editor, api, transform],
  );

  // Keys go to the editor first (capture phase), so a nudge never also pans the viewer.
  useEffect(() => {
    if (!editor) return;
    const onKey = (e: KeyboardEvent) => {
      if (isTypingTarget(e.target) || document.querySelector("dialog[open]")) return;
      if (editor.keyDown({ key: e.key, shift: e.shiftKey, ctrl: e.ctrlKey, meta: e.metaKey, alt: e.altKey })) {
        e.preventDefault();
        e.stopPropagation();
      }
    };
    window.addEventListener("keydown", onKey, true);
    return () => window.removeEventListener("keydown", onKey, true);
  }, [editor]);

  const counts = useMemo(() => {
    const c: Partial<Record<MarkupKind, number>> = {};
    for (const s of state?.shapeList ?? []) c[s.kind] = (c[s.kind] ?? 0) + 1;
    return c;
  }, [state?.shapeList]);

  return { hiddenKinds, toggleKind, labels, setLabels, authors, pick, counts, hiddenReview, toggleReview, isHidden };
}
