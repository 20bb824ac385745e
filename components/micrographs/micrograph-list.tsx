"use client";

import { useState } from "react";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { Button } from "@/components/ui/button";
import { ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import { MosaicStageLine, showsStage } from "@/components/mosaics/mosaic-stage";

function StatusLine({ m }: { m: MicrographDto }) {
  if (showsStage(m)) return <MosaicStageLine m={m} />;
  if (m.status === "ready") return <span className="text-ok-400">Ready</span>;
  if (m.status === "failed")
    return (
      <span className="text-danger-400" role="alert">
        Failed: {m.error}
      </span>
    );
  return (
    <span className="flex flex-col gap-1">
      <span className="text-ink-300">
        {m.status === "queued" ? "Waiting to tile…" : "Tiling"} {m.progress} %
      </span>
      <progress aria-label={`Tiling progress of ${m.label}`} max={100} value={m.progress} className="h-1.5 w-full accent-kerf-500" />
    </span>
  );
}

/** Tiles a failed micrograph again from its kept original; shows the server's refusal. */
function RetryTiling({ m, onRetry }: { m: MicrographDto; onRetry: (id: string) => Promise<void> }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="mt-1 flex items-center gap-2">
      <Button
        className="px-1.5 py-0.5 text-xs"
        disabled={busy}
        aria-label={`Tile ${m.label} again`}
        onClick={() => {
          setBusy(true);
          setError(null);
          onRetry(m.id)
            .catch((e: Error) => setError(e.message))
            .finally(() => setBusy(false));
        }}
      >
        {busy ? "Queuing…" : "Tile again"}
      </Button>
      {error && (
        <span role="alert" className="text-xs text-danger-400">
          {error}
        </span>
      )}
    </span>
  );
}

/**
 * A die's micrographs with thumbnail, illumination, scale and status; click to show one. A
 * failed one offers tiling again (beside its button, not inside it) when `onRetry` is given.
 */
export function MicrographList({
  items,
  selectedId,
  onSelect,
  onRetry,
}: {
  items: MicrographDto[];
  selectedId: string | null;
  onSelect: (id: string) => void;
  onRetry?: (id: string) => Promise<void>;
}) {
  if (items.length === 0) return <p className="text-sm text-ink-400">No micrographs yet.</p>;
  return (
    <ul className="flex flex-col gap-2" aria-label="Micrographs">
      {items.map((m) => (
        <li key={m.id}>
          <button
            type="button"
            onClick={() => onSelect(m.id)}
            aria-current={m.id === selectedId}
            className={`flex w-full gap-3 rounded-md border p-2 text-left text-xs ${m.id === selectedId ? "border-kerf-500 bg-ink-800" : "border-ink-800 hover:bg-ink-850"}`}
          >
            <span className="flex h-12 w-16 shrink-0 items-center justify-center overflow-hidden rounded bg-ink-950">
              {m.status === "ready" ? (
                // eslint-disable-next-line @next/next/no-img-element
                <img src={`/api/micrographs/${m.id}/thumbnail`} alt="" className="max-h-full max-w-full" />
              ) : m.previewWidth ? (
                // eslint-disable-next-line @next/next/no-img-element
                <img src={`/api/micrographs/${m.id}/preview`} alt="" className="max-h-full max-w-full opacity-70" />
              ) : (
                <span className="text-ink-600">…</span>
              )}
            </span>
            <span className="flex min-w-0 flex-1 flex-col gap-0.5">
              <span className="break-words font-medium text-ink-100" title={m.label}>
                {m.label} {m.isReference && <span className="text-kerf-300">(reference)</span>}
              </span>
              <span className="text-ink-400">
                {ILLUMINATION_LABELS[m.illumination]} · {m.width}×{m.height} px · {m.scaleUmPerPx ? `${m.scaleUmPerPx.toPrecision(4)} µm/px` : "scale not set"}
              </span>
              <StatusLine m={m} />
            </span>
          </button>
          {m.status === "failed" && onRetry && <RetryTiling m={m} onRetry={onRetry} />}
        </li>
      ))}
    </ul>
  );
}
