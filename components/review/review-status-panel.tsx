"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { Button } from "@/components/ui/button";
import { ReviewBadge } from "@/components/ui/review-badge";
import { REVIEW_STATUS_LABELS, nextReviewStatus, type ReviewAction } from "@/lib/review/review-status";
import type { DieDto } from "@/lib/dto/dies";
import type { ReviewEventDto } from "@/lib/dto/review";

const ACTION_LABELS: Record<ReviewAction, string> = { submit: "Submit for review", approve: "Approve", request_changes: "Request changes" };

/** The die's review status, the moves the caller may make (with a message), and the history. */
export function ReviewStatusPanel({ die, userId }: { die: DieDto; userId: string }) {
  const qc = useQueryClient();
  const [message, setMessage] = useState("");
  const [error, setError] = useState<string | null>(null);
  const history = useQuery({ queryKey: queryKeys.review(die.id), queryFn: () => apiFetch<ReviewEventDto[]>(`/api/dies/${die.id}/review`) });
  const act = useMutation({
    mutationFn: (action: ReviewAction) => apiFetch<DieDto>(`/api/dies/${die.id}/review`, { method: "POST", body: { action, message } }),
    onSuccess: (d) => {
      qc.setQueryData(queryKeys.die(die.id), d);
      void qc.invalidateQueries({ queryKey: queryKeys.review(die.id) });
      void qc.invalidateQueries({ queryKey: queryKeys.activity(die.id) });
      setMessage("");
      setError(null);
    },
    onError: (e: Error) => setError(e.message),
  });
  const isAnalyst = die.analystId === userId;
  const actions = (["submit", "approve", "request_changes"] as const).filter(
    (a) => nextReviewStatus(die.reviewStatus, a) && can(die.yourRole, a === "submit" ? "edit" : "decide") && !(a !== "submit" && isAnalyst),
  );
  return (
    <section aria-label="Review status" className="flex flex-col gap-2">
      <div className="flex items-center gap-2">
        <h2 className="text-sm font-semibold">Review</h2>
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
          <div className="flex flex-wrap gap-2">
            {actions.map((a) => (
              <Button key={a} variant={a === "request_changes" ? "danger" : "primary"} disabled={act.isPending} onClick={() => act.mutate(a)}>
                {ACTION_LABELS[a]}
              </Button>
            ))}
          </div>
        </>
      )}
      {isAnalyst && die.reviewStatus === "in_review" && (
        <p className="text-xs text-ink-400">You analysed this die, so another owner or reviewer decides its review.</p>
      )}
      {error && (
        <p role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
      <ol aria-label="Review history" className="flex flex-col gap-1 text-xs text-ink-300">
        {(history.data ?? []).map((h) => (
          <li key={h.id}>
            <span className="text-ink-100">{REVIEW_STATUS_LABELS[h.toStatus]}</span> by {h.actorName ?? "former member"} · {new Date(h.at).toLocaleString()}
            {h.message && <span className="block text-ink-400">“{h.message}”</span>}
          </li>
        ))}
      </ol>
    </section>
  );
}
