"use client";

import { niceScaleBarLength } from "@/lib/geometry/scale-bar";
import { useViewVersion } from "./use-view-version";
import type { ViewerApi } from "./viewer-api";

/** The longest bar the layout allows, in CSS px. */
const SCALE_BAR_TARGET_PX = 160;

const BOX = "pointer-events-none select-none rounded-md bg-ink-950/80 px-2 py-1 text-ink-100 shadow-sm";

/**
 * The always-visible scale bar: a round length (1, 2 or 5 × 10^n µm) at the current zoom,
 * redrawn on every view change. Without a scale it asks for a calibration instead.
 */
export function ScaleBar({ api, umPerPx }: { api: ViewerApi | null; umPerPx: number | null }) {
  useViewVersion(api);
  if (umPerPx === null || !(umPerPx > 0)) {
    return (
      <div data-testid="scale-bar" data-scale-set="false" className={BOX}>
        <span data-testid="scale-bar-label" className="text-xs text-kerf-300">
          Scale not set — calibrate
        </span>
      </div>
    );
  }
  const zoom = api ? api.imageZoom() : Number.NaN;
  // Before the first image is open there is no zoom to draw a bar for.
  if (!(zoom > 0) || !Number.isFinite(zoom)) return null;
  const umPerScreenPx = umPerPx / zoom;
  const bar = niceScaleBarLength(umPerScreenPx, SCALE_BAR_TARGET_PX);
  return (
    <div
      data-testid="scale-bar"
      data-scale-set="true"
      data-length-um={bar.lengthUm}
      data-bar-px={bar.px}
      data-um-per-screen-px={umPerScreenPx}
      role="img"
      aria-label={`Scale bar: ${bar.label}`}
      className={BOX}
    >
      <div data-testid="scale-bar-label" className="text-xs font-medium tabular-nums">
        {bar.label}
      </div>
      {/* Border-box sizing: the bar's outer width, end ticks included, is exactly bar.px. */}
      <div data-testid="scale-bar-bar" className="mt-0.5 h-2 border-x-2 border-b-2 border-ink-100" style={{ width: `${bar.px}px` }} />
    </div>
  );
}
