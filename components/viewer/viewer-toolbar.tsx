"use client";

import type { ReactNode } from "react";
import { FitDieIcon, FullScreenIcon, PixelsIcon, ZoomInIcon, ZoomOutIcon } from "./viewer-icons";

function ToolButton({ label, hint, pressed, onClick, children }: { label: string; hint: string; pressed?: boolean; onClick: () => void; children: ReactNode }) {
  const on = pressed === true;
  return (
    <button
      type="button"
      aria-label={label}
      aria-pressed={pressed}
      title={`${label} (${hint})`}
      onClick={onClick}
      className={`flex h-8 w-8 items-center justify-center rounded-md border transition-colors ${
        on ? "border-kerf-500 bg-ink-800 text-kerf-300" : "border-ink-700 bg-ink-900/90 text-ink-200 hover:bg-ink-800 hover:text-ink-100"
      }`}
    >
      {children}
    </button>
  );
}

/** The viewer's own controls: zoom, fit the die, full screen, and honest pixels. */
export function ViewerToolbar({
  onZoomIn,
  onZoomOut,
  onHome,
  onFullScreen,
  isFullScreen,
  showPixels,
  onShowPixels,
}: {
  onZoomIn: () => void;
  onZoomOut: () => void;
  onHome: () => void;
  onFullScreen: () => void;
  isFullScreen: boolean;
  showPixels: boolean;
  onShowPixels: (on: boolean) => void;
}) {
  return (
    <div role="toolbar" aria-label="View" aria-orientation="vertical" className="absolute left-2 top-2 z-20 flex flex-col gap-1">
      <ToolButton label="Zoom in" hint="+" onClick={onZoomIn}>
        <ZoomInIcon />
      </ToolButton>
      <ToolButton label="Zoom out" hint="−" onClick={onZoomOut}>
        <ZoomOutIcon />
      </ToolButton>
      <ToolButton label="Fit die" hint="0" onClick={onHome}>
        <FitDieIcon />
      </ToolButton>
      <ToolButton label="Full screen" hint="browser full screen" pressed={isFullScreen} onClick={onFullScreen}>
        <FullScreenIcon exit={isFullScreen} />
      </ToolButton>
      <div className="my-0.5 h-px bg-ink-700" aria-hidden="true" />
      <ToolButton label="Show pixels" hint="no smoothing when zoomed past 1:1" pressed={showPixels} onClick={() => onShowPixels(!showPixels)}>
        <PixelsIcon />
      </ToolButton>
    </div>
  );
}
