"use client";

import { useState } from "react";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { MicrographViewer, type ViewerApi } from "@/components/viewer";
import { AlignmentPanel } from "./alignment-panel";
import { sourceOf } from "./micrograph-source-of";
import { PairMarkers, type Marker } from "./pair-markers";
import { useAlignmentSession } from "./use-alignment-session";
import { usePointPicker } from "@/components/viewer";

/**
 * The split view for aligning a micrograph: the new one on the left, an aligned one on the
 * right, each zoomable on its own. Numbered control-point pairs are clicked left then right,
 * re-solved live, and accepted into the moving micrograph's transform.
 */
export function AlignmentWorkspace({ moving, fixed, onDone }: { moving: MicrographDto; fixed: MicrographDto; onDone: (accepted: boolean) => void }) {
  const [left, setLeft] = useState<ViewerApi | null>(null);
  const [right, setRight] = useState<ViewerApi | null>(null);
  const session = useAlignmentSession(moving.id, fixed.transform!);
  usePointPicker(left, !session.loading, session.pickLeft);
  usePointPicker(right, !!session.pending, session.pickRight);
  const worst = session.solve && session.pairs.length > 1 ? session.solve.worstIndex : -1;
  const leftMarks: Marker[] = session.pairs.map((p, i) => ({ n: i + 1, imagePx: p.imagePx, worst: i === worst }));
  if (session.pending) leftMarks.push({ n: session.pairs.length + 1, imagePx: session.pending, pending: true });
  const rightMarks: Marker[] = session.pairs.map((p, i) => ({ n: i + 1, imagePx: p.fixedPx, worst: i === worst }));
  const pane = (m: MicrographDto, set: (a: ViewerApi) => void, api: ViewerApi | null, side: "left" | "right", marks: Marker[]) => {
    const source = sourceOf(m);
    if (!source || !m.width || !m.height) return <p className="p-4 text-sm text-ink-400">“{m.label}” is still being prepared.</p>;
    return (
      <div className="relative min-w-0 flex-1" data-testid={`align-${side}`} data-micrograph-id={m.id}>
        <p className="pointer-events-none absolute left-1/2 top-2 z-20 -translate-x-1/2 rounded bg-ink-900/90 px-2 py-0.5 text-xs text-ink-200">
          {side === "left" ? `New: ${m.label}` : `Aligned: ${m.label}`}
        </p>
        <MicrographViewer source={source} imageWidth={m.width} imageHeight={m.height} umPerPx={m.scaleUmPerPx} transform={m.transform} onReady={set}>
          {api && (
            <PairMarkers api={api} side={side} markers={marks} onMove={(n, p) => (n <= session.pairs.length ? session.move(n - 1, side, p) : undefined)} />
          )}
        </MicrographViewer>
      </div>
    );
  };
  return (
    <div className="flex h-full w-full" data-testid="alignment-workspace">
      <div className="flex min-w-0 flex-1 gap-px bg-ink-800">
        {pane(moving, setLeft, left, "left", leftMarks)}
        {pane(fixed, setRight, right, "right", rightMarks)}
      </div>
      <AlignmentPanel movingId={moving.id} fixedId={fixed.id} session={session} onAccepted={() => onDone(true)} onCancel={() => onDone(false)} />
    </div>
  );
}
