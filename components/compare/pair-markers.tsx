"use client";

import { useViewVersion, type ViewerApi } from "@/components/viewer";

export type Marker = { readonly n: number; readonly imagePx: readonly [number, number]; readonly worst?: boolean; readonly pending?: boolean };

/**
 * Numbered control-point marks over one viewer, redrawn with the view. Each mark can be
 * dragged (pointer capture) to move its point; onMove gets the new image px.
 */
export function PairMarkers({
  api,
  side,
  markers,
  onMove,
}: {
  api: ViewerApi;
  side: "left" | "right";
  markers: readonly Marker[];
  onMove?: (n: number, p: [number, number]) => void;
}) {
  useViewVersion(api);
  const toImage = (e: React.PointerEvent) => {
    const r = api.viewer.element.getBoundingClientRect();
    const p = api.screenToImage(e.clientX - r.left, e.clientY - r.top);
    return [p.x, p.y] as [number, number];
  };
  return (
    <svg className="pointer-events-none absolute inset-0 z-10 h-full w-full overflow-visible" aria-hidden="true">
      {markers.map((m) => {
        const s = api.imageToScreen(m.imagePx[0], m.imagePx[1]);
        if (!Number.isFinite(s.x)) return null;
        const colour = m.pending ? "var(--color-ink-100)" : m.worst ? "var(--color-danger-400)" : "var(--color-kerf-300)";
        return (
          <g
            key={m.n}
            data-testid={`pair-marker-${side}-${m.n}`}
            data-image-x={m.imagePx[0]}
            data-image-y={m.imagePx[1]}
            data-worst={m.worst ? "true" : undefined}
            className={onMove ? "pointer-events-auto cursor-move" : undefined}
            onPointerDown={(e) => {
              e.stopPropagation();
              (e.currentTarget as Element).setPointerCapture(e.pointerId);
            }}
            onPointerMove={(e) => {
              if (onMove && (e.currentTarget as Element).hasPointerCapture(e.pointerId)) onMove(m.n, toImage(e));
            }}
          >
            <circle cx={s.x} cy={s.y} r="9" fill="transparent" stroke="var(--color-ink-950)" strokeWidth="3" />
            <circle cx={s.x} cy={s.y} r="9" fill="none" stroke={colour} strokeWidth="1.5" strokeDasharray={m.pending ? "3 2" : undefined} />
            <path d={`M${s.x - 4} ${s.y}h8M${s.x} ${s.y - 4}v8`} stroke={colour} strokeWidth="1" />
            <text x={s.x + 12} y={s.y - 10} fill={colour} stroke="var(--color-ink-950)" strokeWidth="3" paintOrder="stroke" fontSize="12" fontWeight="600">
              {m.n}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
