"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { Button } from "@/components/ui/button";
import { REVIEW_STATUS_LABELS } from "@/lib/review/review-status";
import type { DieDto } from "@/lib/dto/dies";
import type { RevisionDto } from "@/lib/dto/revisions";

/** The die's revisions: each signed-off one with who, when and its SHA-256, and the way to open the next. */
export function RevisionList({ die }: { die: DieDto }) {
  const qc = useQueryClient();
  const revisions = useQuery({ queryKey: queryKeys.revisions(die.id), queryFn: () => apiFetch<RevisionDto[]>(`/api/dies/${die.id}/revisions`) });
  const open = useMutation({
    mutationFn: () => apiFetch<RevisionDto>(`/api/dies/${die.id}/revisions`, { method: "POST" }),
    onSuccess: () => {
      for (const key of [queryKeys.die(die.id), queryKeys.review(die.id), queryKeys.activity(die.id), queryKeys.revisions(die.id)]) {
        void qc.invalidateQueries({ queryKey: key });
      }
    },
  });
  return (
    <section aria-label="Revisions" className="flex flex-col gap-1 border-t border-ink-800 pt-2">
      <h3 className="text-xs font-semibold text-ink-200">Revisions</h3>
      {revisions.isPending && <p className="text-xs text-ink-400">Loading revisions…</p>}
      <ol className="flex flex-col gap-1 text-xs text-ink-300">
        {(revisions.data ?? []).map((r) => (
          <li key={r.number}>
            <span className="text-ink-100">Revision {r.number}</span> · {REVIEW_STATUS_LABELS[r.status]}
            {r.signedOffBy && (
              <>
                {" "}
                by {r.signedOffBy} · {new Date(r.signedOffAt!).toLocaleString()}
              </>
            )}{" "}
            · {r.shapeCount} shapes ·{" "}
            <a className="text-kerf-300 underline" href={`/api/dies/${die.id}/revisions/${r.number}/markup.geojson`}>
              GeoJSON
            </a>
            {r.sha256 && (
              <span className="block font-mono text-[10px] break-all text-ink-400" title="SHA-256 of the signed-off GeoJSON">
                SHA-256 {r.sha256}
              </span>
            )}
          </li>
        ))}
      </ol>
      {die.reviewStatus === "signed_off" && can(die.yourRole, "edit") && (
        <Button disabled={open.isPending} onClick={() => open.mutate()} className="self-start">
          Open revision {die.revision + 1}
        </Button>
      )}
      {open.error && (
        <p role="alert" className="text-xs text-danger-400">
          {open.error.message}
        </p>
      )}
    </section>
  );
}
