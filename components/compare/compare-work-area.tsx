"use client";

import type { ReactNode } from "react";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { ViewerApi } from "@/components/viewer";
import type { Affine2x3 } from "@/lib/geometry/types";
import { Button } from "@/components/ui/button";
import { AlignmentWorkspace } from "./alignment-workspace";
import { COMPARE_MODE_LABELS, CompareView, type CompareMode } from "./compare-view";
import type { WorkMode } from "./work-mode";

type Props = {
  work: Exclude<WorkMode, { kind: "view" }>;
  items: MicrographDto[];
  onWork: (w: WorkMode) => void;
  onAligned: () => void;
  overlay: (api: ViewerApi, imageToDie: Affine2x3) => ReactNode;
  onTopViewer: (api: ViewerApi | null) => void;
};

/** The work area while aligning or comparing, with a way back to the single view. */
export function CompareWorkArea({ work, items, onWork, onAligned, overlay, onTopViewer }: Props) {
  const byId = (id: string) => items.find((m) => m.id === id);
  if (work.kind === "align") {
    const moving = byId(work.movingId);
    const fixed = byId(work.fixedId);
    if (!moving || !fixed?.transform) return <p className="p-4 text-sm text-ink-400">That micrograph is gone.</p>;
    return (
      <AlignmentWorkspace
        key={moving.id}
        moving={moving}
        fixed={fixed}
        onDone={(accepted) => {
          if (accepted) onAligned();
          onWork(accepted ? { kind: "compare", topId: moving.id, bottomId: fixed.id, mode: "overlay" } : { kind: "view" });
        }}
      />
    );
  }
  const top = byId(work.topId);
  const bottom = byId(work.bottomId);
  if (!top?.transform || !bottom?.transform) return <p className="p-4 text-sm text-ink-400">Both micrographs must be aligned to compare them.</p>;
  return (
    <div className="flex h-full flex-col">
      <div className="flex items-center gap-1.5 border-b border-ink-800 bg-ink-900 px-3 py-1">
        {(Object.keys(COMPARE_MODE_LABELS) as CompareMode[]).map((mode) => (
          <Button
            key={mode}
            variant={mode === work.mode ? "primary" : "secondary"}
            className="px-2 py-0.5 text-xs"
            aria-pressed={mode === work.mode}
            onClick={() => onWork({ ...work, mode })}
          >
            {COMPARE_MODE_LABELS[mode]}
          </Button>
        ))}
        <Button className="px-2 py-0.5 text-xs" onClick={() => onWork({ ...work, topId: work.bottomId, bottomId: work.topId })}>
          Swap
        </Button>
        <Button className="ml-auto px-2 py-0.5 text-xs" onClick={() => onWork({ kind: "view" })}>
          Back to one micrograph
        </Button>
      </div>
      <div className="min-h-0 flex-1">
        {/* Side by side and stacked hold different viewers: a new view (and viewer APIs) for each. */}
        <CompareView
          key={`${top.id}-${bottom.id}-${work.mode === "side_by_side" ? "pair" : "stack"}`}
          top={top}
          bottom={bottom}
          mode={work.mode}
          overlay={overlay}
          onTopViewer={onTopViewer}
        />
      </div>
    </div>
  );
}
