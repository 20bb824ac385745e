"use client";

import { useEffect, useLayoutEffect, useRef, useState, type RefObject } from "react";
import type OpenSeadragon from "openseadragon";
import { loadOpenSeadragon } from "./load-openseadragon";
import { sourceKey, tileSpecFor, type MicrographSource } from "./micrograph-source";
import { createViewerApi, type ImageSizeGetter, type OsdNamespace, type ViewerApi } from "./viewer-api";
import { markViewIdle } from "./view-idle-marker";

/** Deepest zoom, in screen px per full-resolution image px: far enough to see single pixels. */
const MAX_SCREEN_PX_PER_IMAGE_PX = 8;

export type ViewerStatus = { state: "loading" } | { state: "ready" } | { state: "failed"; message: string };

function viewerOptions(element: HTMLElement, drawer?: "webgl" | "canvas"): OpenSeadragon.Options {
  return {
    element,
    ...(drawer ? { drawer } : {}),
    showNavigationControl: false,
    showNavigator: true,
    navigatorPosition: "BOTTOM_RIGHT",
    navigatorSizeRatio: 0.18,
    navigatorAutoFade: false,
    navigatorBackground: "var(--color-ink-900)",
    navigatorBorderColor: "var(--color-ink-600)",
    navigatorDisplayRegionColor: "var(--color-kerf-400)",
    navigatorOpacity: 0.92,
    maxZoomPixelRatio: MAX_SCREEN_PX_PER_IMAGE_PX,
    // Our container takes the keyboard; OpenSeadragon's own keys (rotate, flip) stay off and
    // its canvas stays out of the tab order so there is one tab stop.
    keyboardNavEnabled: false,
    tabIndex: -1,
    // Adding the pyramid over the preview must not jump back to the home view.
    preserveViewport: true,
    animationTime: 0.8,
    imageSmoothingEnabled: true,
  };
}

/**
 * maxZoomPixelRatio counts pixels of the displayed source; for the preview those are about
 * ten times larger than full-resolution pixels, so scale it to keep one zoom limit.
 */
function limitZoom(viewer: OpenSeadragon.Viewer, size: ImageSizeGetter): void {
  const item = viewer.world.getItemAt(0);
  const width = size().width;
  if (!item || !(width > 0)) return;
  const k = item.source.dimensions.x / width;
  if (k > 0) viewer.viewport.setMaxZoomPixelRatio(MAX_SCREEN_PX_PER_IMAGE_PX / k, true, true);
}

function watchOpen(viewer: OpenSeadragon.Viewer, size: ImageSizeGetter, setStatus: (s: ViewerStatus) => void): void {
  viewer.addHandler("open", () => {
    limitZoom(viewer, size);
    setStatus({ state: "ready" });
  });
  viewer.addHandler("open-failed", (e) => setStatus({ state: "failed", message: e.message || "the image could not be opened" }));
}

/**
 * Shows source in the viewer. The first image is opened; later ones (the pyramid replacing
 * the preview) are swapped in place, so the old image stays on screen until the new one is
 * ready and the view does not move: both occupy the same world rectangle (x 0, y 0, width 1).
 */
function showSource(viewer: OpenSeadragon.Viewer, source: MicrographSource, size: ImageSizeGetter, setStatus: (s: ViewerStatus) => void): void {
  const spec = tileSpecFor(source);
  if (viewer.world.getItemCount() === 0) {
    viewer.open(spec);
    return;
  }
  const bounds = viewer.viewport.getBounds();
  viewer.addTiledImage({
    ...spec,
    index: 0,
    replace: true,
    x: 0,
    y: 0,
    width: 1,
    success: () => {
      viewer.viewport.fitBounds(bounds, true);
      limitZoom(viewer, size);
      setStatus({ state: "ready" });
    },
    error: () => setStatus({ state: "failed", message: "the new image could not be opened" }),
  });
}

/**
 * Creates an OpenSeadragon viewer inside host, keeps it showing source, and destroys it on
 * unmount. Returns the viewer's API once it exists, the loaded namespace, and the load status.
 */
export function useOsdViewer(
  host: RefObject<HTMLDivElement | null>,
  source: MicrographSource,
  imageWidth: number,
  imageHeight: number,
  drawer?: "webgl" | "canvas",
) {
  const [api, setApi] = useState<ViewerApi | null>(null);
  const [osd, setOsd] = useState<OsdNamespace | null>(null);
  const [status, setStatus] = useState<ViewerStatus>({ state: "loading" });
  // Read by the viewer's callbacks at call time, so they always see the latest props.
  const sourceRef = useRef(source);
  const sizeRef = useRef({ width: imageWidth, height: imageHeight });
  useLayoutEffect(() => {
    sourceRef.current = source;
    sizeRef.current = { width: imageWidth, height: imageHeight };
  });

  useEffect(() => {
    let cancelled = false;
    let viewer: OpenSeadragon.Viewer | null = null;
    loadOpenSeadragon().then(
      (ns) => {
        if (cancelled || !host.current) return;
        const getSize: ImageSizeGetter = () => sizeRef.current;
        viewer = new ns.Viewer(viewerOptions(host.current, drawer));
        watchOpen(viewer, getSize, setStatus);
        markViewIdle(viewer);
        setOsd(() => ns);
        setApi(createViewerApi(ns, viewer, getSize));
      },
      (e: unknown) => setStatus({ state: "failed", message: e instanceof Error ? e.message : "the viewer could not start" }),
    );
    return () => {
      cancelled = true;
      viewer?.destroy();
      setApi(null);
    };
  }, [host, drawer]);

  const key = sourceKey(source);
  useEffect(() => {
    if (!api) return;
    // The status stays as it is during a swap: the old image is still there to look at.
    showSource(api.viewer, sourceRef.current, () => sizeRef.current, setStatus);
  }, [api, key]);

  return { api, osd, status };
}
