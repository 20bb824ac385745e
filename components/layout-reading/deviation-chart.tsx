"use client";

import { axisDecimals, deviationHistogram } from "@/lib/symmetry";
import { deviationColour } from "@/lib/layout-reading/symmetry-view";

const W = 320;
const H = 120;
const PAD = { left: 28, right: 8, top: 8, bottom: 22 };

/**
 * Histogram of pair deviations drawn as plain SVG: bars coloured on the same scale as the
 * canvas ghosts, the tolerance as a dashed line. Each bar names its range and count.
 */
export function DeviationChart({ deviations, toleranceUm, fullScaleUm }: { deviations: readonly number[]; toleranceUm: number; fullScaleUm: number }) {
  if (deviations.length === 0) return null;
  const bins = deviationHistogram(deviations, Math.min(12, Math.max(4, Math.ceil(Math.sqrt(deviations.length)))));
  const lo = bins[0].fromUm;
  const hi = bins[bins.length - 1].toUm;
  const top = Math.max(...bins.map((b) => b.count));
  const x = (v: number) => PAD.left + ((v - lo) / (hi - lo)) * (W - PAD.left - PAD.right);
  const y = (c: number) => H - PAD.bottom - (c / top) * (H - PAD.top - PAD.bottom);
  // Enough decimals that the two ends differ, however small the spread.
  const d = axisDecimals(lo, hi);
  const fmt = (v: number) => v.toFixed(d);
  const tolX = Number.isFinite(toleranceUm) && toleranceUm >= lo && toleranceUm <= hi ? x(toleranceUm) : null;
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-label={`Histogram of ${deviations.length} pair deviations from ${fmt(lo)} to ${fmt(hi)} µm`}
      className="w-full"
    >
      <line x1={PAD.left} y1={H - PAD.bottom} x2={W - PAD.right} y2={H - PAD.bottom} stroke="#3c444c" />
      <line x1={PAD.left} y1={PAD.top} x2={PAD.left} y2={H - PAD.bottom} stroke="#3c444c" />
      {bins.map((b) => (
        <rect
          key={b.fromUm}
          x={x(b.fromUm) + 1}
          y={y(b.count)}
          width={Math.max(1, x(b.toUm) - x(b.fromUm) - 2)}
          height={H - PAD.bottom - y(b.count)}
          fill={deviationColour((b.fromUm + b.toUm) / 2, fullScaleUm)}
        >
          <title>{`${fmt(b.fromUm)}–${fmt(b.toUm)} µm: ${b.count} pair${b.count === 1 ? "" : "s"}`}</title>
        </rect>
      ))}
      {tolX !== null && <line x1={tolX} y1={PAD.top} x2={tolX} y2={H - PAD.bottom} stroke="#e6eaed" strokeDasharray="4 3" />}
      <text x={PAD.left} y={H - 6} fontSize="10" fill="#a3adb6">
        {fmt(lo)}
      </text>
      <text x={W - PAD.right} y={H - 6} fontSize="10" fill="#a3adb6" textAnchor="end">
        {fmt(hi)} µm
      </text>
      <text x={PAD.left - 4} y={PAD.top + 8} fontSize="10" fill="#a3adb6" textAnchor="end">
        {top}
      </text>
      <text x={PAD.left - 4} y={H - PAD.bottom} fontSize="10" fill="#a3adb6" textAnchor="end">
        0
      </text>
    </svg>
  );
}
