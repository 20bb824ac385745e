"use client";

import { useState, useSyncExternalStore } from "react";
import { clampPanelWidth, DEFAULT_PANEL_WIDTH, MIN_PANEL_WIDTH, PANEL_WIDTH_KEY, parseStoredWidth } from "@/lib/client/panel-width";

function subscribeStorage(changed: () => void): () => void {
  window.addEventListener("storage", changed);
  return () => window.removeEventListener("storage", changed);
}

/**
 * The side panel's width, remembered in localStorage. Hydration renders the default on server
 * and client alike (the server snapshot is null), then React re-renders with the stored width.
 */
export function useSidePanelWidth() {
  const stored = parseStoredWidth(
    useSyncExternalStore(
      subscribeStorage,
      () => window.localStorage.getItem(PANEL_WIDTH_KEY),
      () => null,
    ),
  );
  const [dragged, setDragged] = useState<number | null>(null);
  const width = dragged ?? (stored !== null ? clampPanelWidth(stored, window.innerWidth) : DEFAULT_PANEL_WIDTH);
  const resize = (w: number) => {
    const next = clampPanelWidth(w, window.innerWidth);
    setDragged(next);
    try {
      window.localStorage.setItem(PANEL_WIDTH_KEY, String(next));
    } catch {
      // Storage full or refused (private mode): the width still applies for this visit.
    }
  };
  return { width, resize };
}

const KEY_STEP = 16;

/** The handle on the panel's left edge: drag it, or focus it and use ←/→ (Home: default width). */
export function PanelResizer({ width, onResize }: { width: number; onResize: (width: number) => void }) {
  const onPointerDown = (e: React.PointerEvent<HTMLDivElement>) => {
    if (e.button !== 0) return;
    e.preventDefault();
    const el = e.currentTarget;
    const startX = e.clientX;
    const startWidth = width;
    el.setPointerCapture(e.pointerId);
    // The panel is on the right: dragging left widens it.
    const move = (ev: PointerEvent) => onResize(startWidth + (startX - ev.clientX));
    const up = () => {
      el.removeEventListener("pointermove", move);
      el.removeEventListener("pointerup", up);
      el.removeEventListener("pointercancel", up);
    };
    el.addEventListener("pointermove", move);
    el.addEventListener("pointerup", up);
    el.addEventListener("pointercancel", up);
  };
  const onKeyDown = (e: React.KeyboardEvent<HTMLDivElement>) => {
    const step = e.shiftKey ? KEY_STEP * 4 : KEY_STEP;
    if (e.key === "ArrowLeft") onResize(width + step);
    else if (e.key === "ArrowRight") onResize(width - step);
    else if (e.key === "Home") onResize(DEFAULT_PANEL_WIDTH);
    else return;
    e.preventDefault();
  };
  return (
    <div
      role="separator"
      aria-orientation="vertical"
      aria-label="Side panel width"
      aria-valuenow={width}
      aria-valuemin={MIN_PANEL_WIDTH}
      tabIndex={0}
      title="Drag to resize the side panel (or focus and use ← →)"
      onPointerDown={onPointerDown}
      onKeyDown={onKeyDown}
      className="w-1.5 shrink-0 cursor-col-resize touch-none border-l border-ink-800 bg-ink-900 hover:bg-kerf-500/40 focus-visible:bg-kerf-500/60 focus-visible:outline-none"
    />
  );
}
