"use client";

import type { KeyboardEvent, PointerEvent, RefObject } from "react";

/**
 * The draggable line of the split mode, as a slider for keyboards and screen readers too
 * (arrow keys move it 2 %). `value` is the fraction of the width (or height) left of (above) it.
 */
export function SplitDivider({
  host,
  value,
  vertical,
  onChange,
}: {
  host: RefObject<HTMLDivElement | null>;
  value: number;
  vertical: boolean;
  onChange: (v: number) => void;
}) {
  const fromPointer = (e: PointerEvent<HTMLDivElement>) => {
    const r = host.current?.getBoundingClientRect();
    if (!r) return;
    const f = vertical ? (e.clientX - r.left) / r.width : (e.clientY - r.top) / r.height;
    onChange(Math.min(1, Math.max(0, f)));
  };
  const onKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const step = { ArrowLeft: -0.02, ArrowUp: -0.02, ArrowRight: 0.02, ArrowDown: 0.02 }[e.key];
    if (step === undefined) return;
    e.preventDefault();
    e.stopPropagation();
    onChange(Math.min(1, Math.max(0, value + step)));
  };
  const pos = `${value * 100}%`;
  return (
    <div
      role="slider"
      tabIndex={0}
      aria-label="Split divider"
      aria-orientation={vertical ? "horizontal" : "vertical"}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={Math.round(value * 100)}
      data-testid="split-divider"
      onKeyDown={onKey}
      onPointerDown={(e) => {
        e.currentTarget.setPointerCapture(e.pointerId);
        e.stopPropagation();
      }}
      onPointerMove={(e) => {
        if (e.currentTarget.hasPointerCapture(e.pointerId)) fromPointer(e);
      }}
      className={`absolute z-20 bg-kerf-400 shadow focus-visible:outline-2 ${vertical ? "inset-y-0 w-1 -translate-x-1/2 cursor-ew-resize" : "inset-x-0 h-1 -translate-y-1/2 cursor-ns-resize"}`}
      style={vertical ? { left: pos } : { top: pos }}
    />
  );
}
