"use client";

import { useEffect, useState } from "react";
import type { MicrographDto, MosaicDto } from "@/lib/dto/micrographs";
import type { ViewerApi } from "@/components/viewer";

/** A pair is weak when the stage model replaced its measurement (its overlap did not register). */
export const isWeakPair = (p: MosaicDto["pairs"][number]) => p.used === "stage_model";

/** Redraws on every view change (pan, zoom, resize), reading the current view. */
function useViewTick(api: ViewerApi): number {
  const [tick, setTick] = useState(0);
  useEffect(() => api.onViewChange(() => setTick((t) => t + 1)), [api]);
  return tick;
}

function Outlines({ api, mosaic }: { api: ViewerApi; mosaic: MosaicDto }) {
  useViewTick(api);
  const at = (x: number, y: number) => api.imageToScreen(x, y);
  const byIndex = new Map(mosaic.frames.map((f) => [f.index, f]));
  const w = mosaic.frameWidth;
  const h = mosaic.frameHeight;
  return (
    <svg
      data-testid="frame-outlines"
      className="pointer-events-none absolute inset-0 z-10 h-full w-full overflow-visible"
      aria-label="Frame outlines and pair quality"
    >
      {mosaic.frames.map((f) => {
        const a = at(f.x, f.y);
        const b = at(f.x + w, f.y + h);
        const mid = at(f.x + w / 2, f.y + h / 2);
        return (
          <g key={f.index}>
            <rect x={a.x} y={a.y} width={b.x - a.x} height={b.y - a.y} fill="none" stroke="rgba(0,0,0,0.6)" strokeWidth={3} />
            <rect x={a.x} y={a.y} width={b.x - a.x} height={b.y - a.y} fill="none" className="stroke-sky-300" strokeWidth={1.5} />
            <text
              x={mid.x}
              y={mid.y}
              textAnchor="middle"
              dominantBaseline="central"
              className="fill-sky-200 text-xs font-semibold"
              paintOrder="stroke"
              stroke="rgba(0,0,0,0.75)"
              strokeWidth={3}
            >
              {f.index + 1}
            </text>
          </g>
        );
      })}
      {mosaic.pairs.map((p) => {
        const fa = byIndex.get(p.a);
        const fb = byIndex.get(p.b);
        if (!fa || !fb) return null;
        // The marker sits in the middle of the two frames' overlap.
        const c = at((fa.x + fb.x + w) / 2, (fa.y + fb.y + h) / 2);
        const weak = isWeakPair(p);
        const title = `Frames ${p.a + 1}–${p.b + 1}: peak ${p.peak.toFixed(3)}, ${weak ? "weak — stage model used" : "measured"} (dx ${p.dx.toFixed(1)}, dy ${p.dy.toFixed(1)} px)`;
        return (
          <g key={`${p.a}-${p.b}`} className="pointer-events-auto cursor-help" data-pair={`${p.a}-${p.b}`} data-weak={weak}>
            <title>{title}</title>
            {weak ? (
              <rect
                x={c.x - 6}
                y={c.y - 6}
                width={12}
                height={12}
                transform={`rotate(45 ${c.x} ${c.y})`}
                className="fill-amber-400 stroke-black"
                strokeWidth={1}
                strokeDasharray="2 1"
              />
            ) : (
              <circle cx={c.x} cy={c.y} r={5} className="fill-emerald-400 stroke-black" strokeWidth={1} />
            )}
          </g>
        );
      })}
    </svg>
  );
}

/**
 * The viewer's "Frame outlines" toggle for a stitched micrograph: each frame's rectangle where
 * it was placed, numbered in capture order, and a marker per neighbour pair in their overlap —
 * a round green one when the pair registered, an amber diamond when it was weak and the stage
 * model was used; hovering a marker gives its peak.
 */
export function FrameOutlines({ api, micrograph }: { api: ViewerApi | null; micrograph: MicrographDto }) {
  const [on, setOn] = useState(false);
  const mosaic = micrograph.mosaic;
  if (!api || !mosaic || mosaic.frames.length === 0) return null;
  return (
    <>
      {on && <Outlines api={api} mosaic={mosaic} />}
      <label className="absolute right-3 top-14 z-20 flex items-center gap-2 rounded-md border border-ink-700 bg-ink-900/95 px-2 py-1 text-xs text-ink-100">
        <input type="checkbox" checked={on} onChange={(e) => setOn(e.target.checked)} className="accent-kerf-500" />
        Frame outlines
      </label>
    </>
  );
}
