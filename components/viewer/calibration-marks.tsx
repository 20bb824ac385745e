"use client";

import { useViewVersion } from "./use-view-version";
import type { ViewerApi } from "./viewer-api";

/** Image px pair as printed beside a calibration point. */
function pxLabel([x, y]: readonly [number, number]): string {
  return `(${x.toFixed(1)}, ${y.toFixed(1)}) px`;
}

/**
 * The chosen calibration points and the line between them, drawn in screen space from image
 * px on every view change, so they stay on the feature while the user pans and zooms.
 */
export function CalibrationMarks({ api, points }: { api: ViewerApi; points: readonly (readonly [number, number])[] }) {
  useViewVersion(api);
  const screen = points.map(([x, y]) => api.imageToScreen(x, y));
  if (screen.some((p) => !Number.isFinite(p.x) || !Number.isFinite(p.y))) return null;
  return (
    <svg data-testid="calibration-marks" className="pointer-events-none absolute inset-0 h-full w-full overflow-visible" aria-hidden="true">
      {screen.length === 2 && (
        <>
          <line x1={screen[0].x} y1={screen[0].y} x2={screen[1].x} y2={screen[1].y} stroke="var(--color-ink-950)" strokeWidth="4" />
          <line x1={screen[0].x} y1={screen[0].y} x2={screen[1].x} y2={screen[1].y} stroke="var(--color-kerf-400)" strokeWidth="2" />
        </>
      )}
      {screen.map((p, i) => (
        <g key={i} data-testid={`calibration-point-${i + 1}`} data-image-x={points[i][0]} data-image-y={points[i][1]}>
          <circle cx={p.x} cy={p.y} r="6" fill="none" stroke="var(--color-ink-950)" strokeWidth="3" />
          <circle cx={p.x} cy={p.y} r="6" fill="none" stroke="var(--color-kerf-300)" strokeWidth="1.5" />
          <path d={`M${p.x - 10} ${p.y}h6m8 0h6M${p.x} ${p.y - 10}v6m0 8v6`} stroke="var(--color-kerf-300)" strokeWidth="1.5" />
          <text x={p.x + 10} y={p.y - 10} fill="var(--color-ink-100)" stroke="var(--color-ink-950)" strokeWidth="3" paintOrder="stroke" fontSize="11">
            {pxLabel(points[i])}
          </text>
        </g>
      ))}
    </svg>
  );
}
