"use client";

import { useEffect, useState } from "react";
import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { shapeLabel } from "@/lib/markup/markup-table";
import type { ViewerApi } from "@/components/viewer";
import { Button } from "@/components/ui/button";
import { KIND_STYLE } from "../palette";
import { candidateAt } from "./candidates";
import type { SimilarSearch } from "./use-similar-search";

/** True while Space is held (the view pans then, whatever else is on top). */
function useSpaceHeld() {
  const [held, setHeld] = useState(false);
  useEffect(() => {
    const down = (e: KeyboardEvent) =>
      e.code === "Space" && !(e.target instanceof HTMLInputElement || e.target instanceof HTMLTextAreaElement) && setHeld(true);
    const up = (e: KeyboardEvent) => e.code === "Space" && setHeld(false);
    window.addEventListener("keydown", down);
    window.addEventListener("keyup", up);
    return () => {
      window.removeEventListener("keydown", down);
      window.removeEventListener("keyup", up);
    };
  }, []);
  return held;
}

/**
 * While candidates are reviewed, clicks on the view go to them (drop or keep) instead of the
 * markup tools; the wheel still zooms and Space + drag still pans.
 */
function CandidateClicks({ api, imageToDie, similar }: { api: ViewerApi; imageToDie: Affine2x3; similar: SimilarSearch }) {
  const space = useSpaceHeld();
  return (
    <div
      data-testid="candidate-layer"
      className={`absolute inset-0 ${space ? "pointer-events-none" : "pointer-events-auto"} cursor-pointer`}
      onPointerDown={(e) => {
        if (e.button !== 0) return;
        const rect = (e.currentTarget as HTMLElement).getBoundingClientRect();
        const img = api.screenToImage(e.clientX - rect.left, e.clientY - rect.top);
        const hit = candidateAt(similar.shown, applyAffine(imageToDie, img.x, img.y));
        if (hit !== null) similar.toggle(hit);
      }}
      onWheel={(e) => {
        const rect = (e.currentTarget as HTMLElement).getBoundingClientRect();
        api.zoomAt(e.deltaY < 0 ? 1.2 : 1 / 1.2, e.clientX - rect.left, e.clientY - rect.top);
      }}
    />
  );
}

// Top centre, one compact block above the die's top row of pads at the fit view (as the calibration tool's panel).
const panel =
  "pointer-events-auto absolute left-1/2 top-2 z-30 flex w-[min(36rem,calc(100%-7rem))] -translate-x-1/2 flex-col gap-1.5 rounded-lg border border-ink-700 bg-ink-900/95 px-3 py-2 text-xs text-ink-100 shadow-lg";

/** The search's progress, then the score slider, the counts and "Add N"; Escape or Cancel ends it. */
function SimilarPanel({ similar }: { similar: SimilarSearch }) {
  const s = similar.session;
  if (!s) return null;
  const what = `${KIND_STYLE[s.template.kind].label.toLowerCase()}${shapeLabel(s.template) ? ` ${shapeLabel(s.template)}` : ""}`;
  const cancel = (
    <Button onClick={similar.cancel} aria-keyshortcuts="Escape">
      Cancel
    </Button>
  );
  if (s.phase === "searching") {
    return (
      <section role="region" aria-label="Find similar" className={panel}>
        <div className="flex items-center gap-3">
          <p className="shrink-0">Looking for shapes like {what}…</p>
          <progress max={100} value={s.progress} aria-label="Search progress" className="h-1.5 min-w-0 flex-1 accent-kerf-500" />
          <span className="shrink-0 tabular-nums">{Math.round(s.progress)} %</span>
          {cancel}
        </div>
      </section>
    );
  }
  if (s.phase === "failed") {
    return (
      <section role="region" aria-label="Find similar" className={panel}>
        <div className="flex items-center gap-3">
          <p role="alert" className="flex-1 text-danger-400">
            {s.message}
          </p>
          {cancel}
        </div>
      </section>
    );
  }
  const threshold = s.threshold.toFixed(2);
  const n = similar.kept.length;
  return (
    <section role="region" aria-label="Find similar" className={panel}>
      <p className="text-ink-300">Shapes like {what}: click one on the image to drop or keep it.</p>
      <div className="flex items-center gap-3">
        <label className="flex min-w-0 flex-1 items-center gap-2">
          <span className="shrink-0 tabular-nums">Score ≥ {threshold}</span>
          <input
            type="range"
            min={0.5}
            max={0.99}
            step={0.01}
            value={s.threshold}
            onChange={(e) => similar.setThreshold(Number(e.target.value))}
            aria-label="Lowest score shown"
            className="min-w-0 flex-1 accent-kerf-500"
          />
        </label>
        <span data-testid="similar-count" className="shrink-0 tabular-nums">
          {similar.shown.length === 0 ? `No similar shapes above ${threshold}` : `${similar.shown.length} found, ${n} kept`}
        </span>
        {cancel}
        <Button variant="primary" disabled={n === 0} onClick={similar.add} className="whitespace-nowrap">
          Add {n}
        </Button>
      </div>
    </section>
  );
}

/**
 * The find-similar layer of one viewer: candidate clicks while reviewing and the panel, shown
 * only on the micrograph the search ran on.
 */
export function SimilarLayer({
  api,
  imageToDie,
  similar,
  micrographId,
}: {
  api: ViewerApi;
  imageToDie: Affine2x3;
  similar: SimilarSearch;
  micrographId: string | null;
}) {
  if (!similar.session || similar.session.micrographId !== micrographId) return null;
  return (
    <>
      {similar.session.phase === "review" && <CandidateClicks api={api} imageToDie={imageToDie} similar={similar} />}
      <SimilarPanel similar={similar} />
    </>
  );
}
