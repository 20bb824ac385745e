"use client";

import { useCallback, useEffect, useState } from "react";

/**
 * Full-screen state of one element through the browser's Fullscreen API. The whole viewer
 * (canvas, overlay, toolbar, scale bar) goes full screen together, which OpenSeadragon's own
 * full-page mode would not do for elements it does not own.
 */
export function useFullScreen(element: HTMLElement | null): { isFullScreen: boolean; toggle: () => void } {
  const [isFullScreen, setIsFullScreen] = useState(false);
  useEffect(() => {
    const sync = () => setIsFullScreen(!!element && document.fullscreenElement === element);
    document.addEventListener("fullscreenchange", sync);
    return () => document.removeEventListener("fullscreenchange", sync);
  }, [element]);
  const toggle = useCallback(() => {
    if (!element) return;
    // A refusal (no user gesture, policy) leaves the page as it was; nothing to report.
    if (document.fullscreenElement === element) document.exitFullscreen().catch(() => {});
    else element.requestFullscreen().catch(() => {});
  }, [element]);
  return { isFullScreen, toggle };
}
