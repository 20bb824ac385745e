"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { ApiError, apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { Button } from "@/components/ui/button";
import { ReviewBadge } from "@/components/ui/review-badge";
import { REVIEW_ACTIONS } from "@/lib/dto/stored-values";
import { REVIEW_ACTION_LABELS, REVIEW_STATUS_LABELS, nextReviewStatus, rightFor, type ReviewAction } from "@/lib/review/review-status";
import type { DieDto } from "@/lib/dto/dies";
import type { ReviewEventDto } from "@/lib/dto/review";
import { RevisionList } from "./revision-list";

/** The die's check status, the moves the caller may make (with a message), the history and the revisions. */
export function ReviewStatusPanel({ die, userId }: { die: DieDto; userId: string }) {
  const qc = useQueryClient();
  const [message, setMessage] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [openRemarks, setOpenRemarks] = useState<number | null>(null);
  const [override, setOverride] = useState(false);
  const history = useQuery({ queryKey: queryKeys.review(die.id), queryFn: () => apiFetch<ReviewEventDto[]>(`/api/dies/${die.id}/review`) });
  const act = useMutation({
    mutationFn: (action: ReviewAction) =>
      apiFetch<DieDto>(`/api/dies/${die.id}/review`, {
        method: "POST",
        body: { action, message, ...(action === "sign_off" && override ? { overrideOpenRemarks: true } : {}) },
      }),
    onSuccess: (d) => {
      qc.setQueryData(queryKeys.die(die.id), d);
      for (const key of [queryKeys.review(die.id), queryKeys.activity(die.id), queryKeys.revisions(die.id)]) void qc.invalidateQueries({ queryKey: key });
      setMessage("");
      setError(null);
      setOpenRemarks(null);
      setOverride(false);
    },
    onError: (e: Error) => {
      setError(e.message);
      if (e instanceof ApiError && typeof e.body.openRemarks === "number") setOpenRemarks(e.body.openRemarks);
    },
  });
  const isAnalyst = die.analystId === userId;
  const lastSend = (history.data ?? []).find((h) => h.action === "send");
  const actions = REVIEW_ACTIONS.filter(
    (a) =>
      nextReviewStatus(die.reviewStatus, a) &&
      can(die.yourRole, rightFor(a)) &&
      !(rightFor(a) === "decide" && isAnalyst) &&
      !(a === "withdraw" && lastSend && lastSend.actorId !== userId),
  );
  return (
    <section aria-label="Check status" className="flex flex-col gap-2">
      <div className="flex items-center gap-2">
        <h2 className="text-sm font-semibold">Check · revision {die.revision}</h2>
        <ReviewBadge status={die.reviewStatus} />
      </div>
      {actions.length > 0 && (
        <>
          <label className="text-xs text-ink-300">
            Message
            <textarea
              value={message}
              onChange={(e) => setMessage(e.target.value)}
              rows={2}
              className="mt-1 w-full rounded-md border border-ink-700 bg-ink-950 p-2 text-sm text-ink-100"
            />
          </label>
          {openRemarks !== null && actions.includes("sign_off") && (
            <label className="flex items-start gap-2 text-xs text-warn-300">
              <input type="checkbox" checked={override} onChange={(e) => setOverride(e.target.checked)} className="mt-0.5" />
              Sign off over {openRemarks === 1 ? "1 open remark" : `${openRemarks} open remarks`} (the message must say why; the history keeps it)
            </label>
          )}
          <div className="flex flex-wrap gap-2">
            {actions.map((a) => (
              <Button
                key={a}
                variant={a === "return" ? "danger" : a === "withdraw" ? "secondary" : "primary"}
                disabled={act.isPending}
                onClick={() => act.mutate(a)}
              >
                {REVIEW_ACTION_LABELS[a]}
              </Button>
            ))}
          </div>
        </>
      )}
      {isAnalyst && die.reviewStatus === "with_checker" && (
        <p className="text-xs text-ink-400">You analysed this die, so another owner or reviewer signs it off or returns it.</p>
      )}
      {error && (
        <p role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
      <ol aria-label="Check history" className="flex flex-col gap-1 text-xs text-ink-300">
        {(history.data ?? []).map((h) => (
          <li key={h.id}>
            <span className="text-ink-100">{REVIEW_STATUS_LABELS[h.toStatus]}</span> (rev. {h.revision}) by {h.actorName ?? "former member"} ·{" "}
            {new Date(h.at).toLocaleString()}
            {h.overrideOpenRemarks && <span className="ml-1 rounded bg-warn-500/20 px-1 text-warn-300">over open remarks</span>}
            {h.message && <span className="block text-ink-400">“{h.message}”</span>}
          </li>
        ))}
      </ol>
      <RevisionList die={die} />
    </section>
  );
}
