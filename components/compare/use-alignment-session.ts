"use client";

import { useEffect, useState } from "react";
import { useSearchParams } from "next/navigation";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { AlignmentDto } from "@/lib/dto/alignment";
import { apiFetch } from "@/lib/client/api";
import { applyAffine, invertAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { MIN_PAIRS, type AlignmentModel } from "@/lib/alignment/fit";
import { writeSearchParams } from "./use-work-mode-url";
import { paramsWithSession, sessionFromParams } from "./work-mode-url";

/** One pair being placed: a point on the new micrograph and the same feature on the aligned one. */
export type SessionPair = { imagePx: [number, number]; fixedPx: [number, number] };
export type Solve = { transform: Affine2x3; residualsUm: number[]; rmsUm: number; worstIndex: number };

/**
 * The state of an alignment: pairs (re-opened from the stored control points), the point waiting
 * for its partner, model and mirrored flag, and a live dry-run solve on every change. Die µm of
 * each pair come from the aligned micrograph's transform.
 */
export function useAlignmentSession(movingId: string, fixedToDie: Affine2x3) {
  const stored = useQuery({ queryKey: queryKeys.alignment(movingId), queryFn: () => apiFetch<AlignmentDto>(`/api/micrographs/${movingId}/alignment`) });
  // A session kept in the URL (reload, Back then Forward) wins over the stored control points.
  const params = useSearchParams();
  const [fromUrl] = useState(() => sessionFromParams(new URLSearchParams(params.toString())));
  const [pairs, setPairs] = useState<SessionPair[] | null>(fromUrl?.pairs ?? null);
  const [pending, setPending] = useState<[number, number] | null>(fromUrl?.pending ?? null);
  const [model, setModel] = useState<AlignmentModel>(fromUrl?.model ?? "similarity");
  const [mirrored, setMirrored] = useState(fromUrl?.mirrored ?? false);
  const [solved, setSolved] = useState<Solve | null>(null);
  // The failure of one request body: shown only while that body is still the current one.
  const [failure, setFailure] = useState<{ key: string; message: string } | null>(null);

  useEffect(() => {
    // Every change is written back into this session's history entry (never a new entry).
    const now = new URLSearchParams(window.location.search);
    if (!pairs || now.get("work") !== "align" || now.get("moving") !== movingId) return;
    writeSearchParams(paramsWithSession(now, { pairs, pending, model, mirrored }), false);
  }, [pairs, pending, model, mirrored, movingId]);

  // The saved alignment arrives after the first render: adopt it once, while rendering (React's
  // "adjusting state when a prop changes"), so no effect runs a second render pass for it.
  if (stored.data && !pairs) {
    const back = invertAffine(fixedToDie);
    setPairs(stored.data.pairs.map((p) => ({ imagePx: p.imagePx, fixedPx: applyAffine(back, p.dieUm[0], p.dieUm[1]) })));
    if (stored.data.model) setModel(stored.data.model);
    setMirrored(stored.data.mirrored);
  }

  const list = pairs ?? [];
  const body = { model, mirrored, pairs: list.map((p) => ({ imagePx: p.imagePx, dieUm: applyAffine(fixedToDie, p.fixedPx[0], p.fixedPx[1]) })) };
  const key = JSON.stringify(body);
  const tooFew = list.length < MIN_PAIRS[model];
  useEffect(() => {
    if (tooFew) return;
    const ctrl = { stale: false };
    const t = setTimeout(async () => {
      try {
        const r = await apiFetch<Solve>(`/api/micrographs/${movingId}/alignment/preview`, { method: "POST", body: JSON.parse(key) });
        if (!ctrl.stale) setSolved(r);
      } catch (e) {
        if (!ctrl.stale) {
          setSolved(null);
          setFailure({ key, message: (e as Error).message });
        }
      }
    }, 120);
    return () => {
      ctrl.stale = true;
      clearTimeout(t);
    };
  }, [key, movingId, tooFew]);

  return {
    loading: !pairs,
    pairs: list,
    pending,
    model,
    mirrored,
    solve: tooFew ? null : solved,
    error: !tooFew && failure?.key === key ? failure.message : null,
    body,
    setModel,
    setMirrored,
    pickLeft: (p: [number, number]) => setPending(p),
    pickRight: (p: [number, number]) => {
      if (!pending) return;
      setPairs([...list, { imagePx: pending, fixedPx: p }]);
      setPending(null);
    },
    move: (i: number, side: "left" | "right", p: [number, number]) =>
      setPairs(list.map((q, k) => (k !== i ? q : side === "left" ? { ...q, imagePx: p } : { ...q, fixedPx: p }))),
    remove: (i: number) => setPairs(list.filter((_, k) => k !== i)),
    cancelPending: () => setPending(null),
  };
}
