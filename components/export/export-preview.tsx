"use client";

import { useEffect, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import type { ExportPreviewDto } from "@/lib/dto/export-preview";
import { queryKeys } from "@/lib/client/query-keys";

/** The last value after it has stopped changing for `ms`. */
function useSettled<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

/** A small rendering of what "Render PNG" would produce, its final size, and any warning or refusal. */
export function ExportPreview({ dieId, formKey, body, onRefresh }: { dieId: string; formKey: string; body: () => unknown; onRefresh: () => void }) {
  const key = useSettled(formKey, 400);
  const preview = useQuery({
    queryKey: queryKeys.exportPreview(dieId, key),
    queryFn: () => apiFetch<ExportPreviewDto>(`/api/dies/${dieId}/exports/preview`, { method: "POST", body: body() }),
    retry: false,
    staleTime: Infinity,
    placeholderData: (previous) => previous,
  });
  const p = preview.data;
  return (
    <figure aria-label="Export preview" aria-busy={preview.isFetching} className="space-y-1 rounded border border-ink-800 bg-ink-950 p-2 text-xs">
      {p ? (
        // A data: URL rendered on request, not a static asset: next/image has nothing to optimise.
        // eslint-disable-next-line @next/next/no-img-element
        <img
          src={`data:image/png;base64,${p.png}`}
          alt="Preview of the annotated PNG"
          width={p.previewWidth}
          height={p.previewHeight}
          className={`h-auto w-full ${preview.isFetching ? "opacity-60" : ""}`}
        />
      ) : (
        <div className="flex h-32 items-center justify-center text-ink-500">{preview.isError ? "No preview" : "Rendering preview…"}</div>
      )}
      <figcaption className="flex items-center justify-between gap-2">
        <span data-testid="export-preview-size">
          {p ? `${p.width} × ${p.height} px at ${p.umPerPx.toPrecision(3)} µm/px` : ""}
          {preview.isFetching && p ? " · updating…" : ""}
        </span>
        <button type="button" className="underline" onClick={onRefresh}>
          Refresh preview
        </button>
      </figcaption>
      {preview.isError && (
        <p role="alert" className="text-red-300">
          {(preview.error as Error).message}
        </p>
      )}
      {!preview.isError &&
        p?.warnings.map((w) => (
          <p key={w} className="text-amber-300">
            {w}
          </p>
        ))}
    </figure>
  );
}
