"use client";

import { useEffect, useRef, useState, type ReactNode } from "react";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { MicrographViewer, type ViewerApi } from "@/components/viewer";
import type { Affine2x3 } from "@/lib/geometry/types";
import { sourceOf } from "./micrograph-source-of";
import { SplitDivider } from "./split-divider";
import { useViewLock } from "./use-view-lock";

export type CompareMode = "side_by_side" | "overlay" | "split";
export const COMPARE_MODE_LABELS: Record<CompareMode, string> = { side_by_side: "Side by side", overlay: "Overlay", split: "Split" };

type Props = {
  /** Shown on top in overlay and split, on the left side by side. */
  top: MicrographDto;
  bottom: MicrographDto;
  mode: CompareMode;
  /** The markup layer for one viewer: drawn once in the die frame, shown on every aligned micrograph. */
  overlay: (api: ViewerApi, imageToDie: Affine2x3) => ReactNode;
  /** The viewer the markup editor draws into (the top one). */
  onTopViewer?: (api: ViewerApi | null) => void;
};

function Pane({
  m,
  onApi,
  children,
  style,
  testId,
}: {
  m: MicrographDto;
  onApi: (a: ViewerApi) => void;
  children?: ReactNode;
  style?: React.CSSProperties;
  testId: string;
}) {
  const source = sourceOf(m);
  if (!source || !m.width || !m.height) return <p className="p-4 text-sm text-ink-400">“{m.label}” is still being prepared.</p>;
  return (
    <div className="absolute inset-0" style={style} data-testid={testId} data-micrograph-id={m.id}>
      <MicrographViewer
        source={source}
        imageWidth={m.width}
        imageHeight={m.height}
        umPerPx={m.scaleUmPerPx}
        transform={m.transform}
        onReady={onApi}
        drawer="canvas"
      >
        {children}
      </MicrographViewer>
    </div>
  );
}

/**
 * Two aligned micrographs of one die compared side by side, overlaid or split. Both viewers
 * are locked in die coordinates, so the same die point is under the same screen px (stacked)
 * or under the matching px of each half (side by side).
 */
export function CompareView({ top, bottom, mode, overlay, onTopViewer }: Props) {
  const [apiTop, setApiTop] = useState<ViewerApi | null>(null);
  const [apiBottom, setApiBottom] = useState<ViewerApi | null>(null);
  const [opacity, setOpacity] = useState(0.5);
  const [divider, setDivider] = useState(0.5);
  const [vertical, setVertical] = useState(true);
  const host = useRef<HTMLDivElement>(null);
  useViewLock({ api: apiTop, imageToDie: top.transform }, { api: apiBottom, imageToDie: bottom.transform });
  useEffect(() => {
    onTopViewer?.(apiTop);
    return () => onTopViewer?.(null);
  }, [apiTop, onTopViewer]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      if (mode !== "overlay" || e.key.toLowerCase() !== "f" || e.ctrlKey || e.metaKey || target?.closest("input, textarea, select")) return;
      setOpacity((o) => (o >= 0.5 ? 0 : 1));
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [mode]);

  const clip = vertical ? `inset(0 ${(1 - divider) * 100}% 0 0)` : `inset(0 0 ${(1 - divider) * 100}% 0)`;
  const stacked = mode !== "side_by_side";
  return (
    <div className="flex h-full w-full flex-col">
      <div className="flex items-center gap-4 border-b border-ink-800 bg-ink-900 px-3 py-1.5 text-xs text-ink-300">
        <span>
          {stacked ? "Top" : "Left"}: <strong className="text-ink-100">{top.label}</strong> · {stacked ? "Below" : "Right"}:{" "}
          <strong className="text-ink-100">{bottom.label}</strong>
        </span>
        {mode === "overlay" && (
          <label className="flex items-center gap-2">
            Opacity of the top one
            <input
              type="range"
              min={0}
              max={100}
              value={Math.round(opacity * 100)}
              onChange={(e) => setOpacity(Number(e.target.value) / 100)}
              aria-label="Overlay opacity"
              className="accent-kerf-500"
            />
            <output>{Math.round(opacity * 100)} %</output>
            <span className="text-ink-400">(F: blink between the two)</span>
          </label>
        )}
        {mode === "split" && (
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={!vertical} onChange={(e) => setVertical(!e.target.checked)} className="accent-kerf-500" /> Horizontal divider
          </label>
        )}
      </div>
      <div ref={host} className={`relative min-h-0 flex-1 ${stacked ? "" : "grid grid-cols-2 gap-px bg-ink-800"}`} data-testid="compare-view" data-mode={mode}>
        {stacked ? (
          <>
            <Pane m={bottom} onApi={setApiBottom} testId="compare-bottom">
              {/* The overlay shows the top one's markup only, so shapes are not drawn twice. */}
              {mode === "split" && apiBottom && bottom.transform && overlay(apiBottom, bottom.transform)}
            </Pane>
            <Pane m={top} onApi={setApiTop} testId="compare-top" style={mode === "overlay" ? { opacity } : { clipPath: clip }}>
              {apiTop && top.transform && overlay(apiTop, top.transform)}
            </Pane>
            {mode === "split" && <SplitDivider host={host} value={divider} vertical={vertical} onChange={setDivider} />}
          </>
        ) : (
          <>
            <div className="relative">
              <Pane m={top} onApi={setApiTop} testId="compare-top">
                {apiTop && top.transform && overlay(apiTop, top.transform)}
              </Pane>
            </div>
            <div className="relative">
              <Pane m={bottom} onApi={setApiBottom} testId="compare-bottom">
                {apiBottom && bottom.transform && overlay(apiBottom, bottom.transform)}
              </Pane>
            </div>
          </>
        )}
      </div>
    </div>
  );
}
