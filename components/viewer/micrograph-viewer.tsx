"use client";

import { useEffect, useId, useRef, useState, type KeyboardEvent, type ReactNode } from "react";
import type { Affine2x3 } from "@/lib/geometry/types";
import { CursorReadout } from "./cursor-readout";
import type { MicrographSource } from "./micrograph-source";
import { ResolutionNote } from "./resolution-note";
import { ScaleBar } from "./scale-bar";
import { useFullScreen } from "./use-full-screen";
import { useOsdViewer } from "./use-osd-viewer";
import type { ViewerApi } from "./viewer-api";
import { isTypingTarget, runViewerAction, viewerActionForKey, ZOOM_STEP, type ViewerAction } from "./viewer-keys";
import { ViewerToolbar } from "./viewer-toolbar";

export type MicrographViewerProps = {
  source: MicrographSource;
  /** Full-resolution size in px; every image coordinate the viewer speaks is in these pixels. */
  imageWidth: number;
  imageHeight: number;
  /** Scale of the micrograph, or null before it is known. */
  umPerPx: number | null;
  /** Image px → die µm (y flips), or null before the micrograph is placed in the die frame. */
  transform: Affine2x3 | null;
  /** Objective NA from the capture data, for the resolution note beside the scale bar. */
  numericalAperture?: number | null;
  /** Called once the viewer exists (again if it is ever re-created). */
  onReady?: (api: ViewerApi) => void;
  /**
   * The overlay layer, positioned over the canvas with the same origin as screen px. The layer
   * itself lets pointer events through to the image; give interactive children
   * `pointer-events: auto` (Tailwind `pointer-events-auto`).
   */
  children?: ReactNode;
  className?: string;
  /**
   * OpenSeadragon's renderer. Viewers that are drawn turned (a comparison's follower) use
   * "canvas": the WebGL one misplaces and drops tiles under a viewport rotation.
   */
  drawer?: "webgl" | "canvas";
};

const SHORTCUTS = "Plus or equals zooms in, minus zooms out, 0 fits the die, arrow keys pan. Drag to pan, scroll to zoom.";

/** The micrograph viewer: deep-zoom image, our own controls, scale bar, cursor readout, overlay layer. */
export function MicrographViewer({
  source,
  imageWidth,
  imageHeight,
  umPerPx,
  transform,
  numericalAperture,
  onReady,
  children,
  className = "",
  drawer,
}: MicrographViewerProps) {
  const keysId = useId();
  const hostRef = useRef<HTMLDivElement>(null);
  const [surface, setSurface] = useState<HTMLDivElement | null>(null);
  const [showPixels, setShowPixels] = useState(false);
  const { api, osd, status } = useOsdViewer(hostRef, source, imageWidth, imageHeight, drawer);
  const fullScreen = useFullScreen(surface);

  const onReadyRef = useRef(onReady);
  useEffect(() => {
    onReadyRef.current = onReady;
  });
  useEffect(() => {
    if (api) onReadyRef.current?.(api);
  }, [api]);

  useEffect(() => {
    api?.viewer.drawer.setImageSmoothingEnabled(!showPixels);
  }, [api, showPixels]);

  const act = (action: ViewerAction) => {
    if (api && osd) runViewerAction(osd, api.viewer, action);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (e.ctrlKey || e.metaKey || e.altKey || isTypingTarget(e.target)) return;
    const action = viewerActionForKey(e.key);
    if (!action) return;
    e.preventDefault(); // keep arrows from scrolling the page
    act(action);
  };

  return (
    <div
      ref={setSurface}
      role="application"
      aria-label="Micrograph viewer"
      aria-describedby={keysId}
      aria-keyshortcuts="+ = - 0 ArrowUp ArrowDown ArrowLeft ArrowRight"
      tabIndex={0}
      onKeyDown={onKeyDown}
      className={`relative h-full w-full overflow-hidden bg-ink-950 focus-visible:outline-offset-[-2px] ${className}`}
    >
      <p id={keysId} className="sr-only">
        {SHORTCUTS}
      </p>
      <div ref={hostRef} data-testid="micrograph-canvas" className="absolute inset-0 bg-ink-950" />
      <div data-testid="viewer-overlay" className="pointer-events-none absolute inset-0 z-10">
        {children}
      </div>
      <ViewerToolbar
        onZoomIn={() => act({ kind: "zoom", factor: ZOOM_STEP })}
        onZoomOut={() => act({ kind: "zoom", factor: 1 / ZOOM_STEP })}
        onHome={() => act({ kind: "home" })}
        onFullScreen={fullScreen.toggle}
        isFullScreen={fullScreen.isFullScreen}
        showPixels={showPixels}
        onShowPixels={setShowPixels}
      />
      <ViewerReadouts api={api} surface={surface} umPerPx={umPerPx} transform={transform} numericalAperture={numericalAperture} />
      <ViewerStatusNote status={status} />
    </div>
  );
}

/** Scale bar and resolution note at the bottom-left, cursor position at the bottom centre. */
function ViewerReadouts({
  api,
  surface,
  umPerPx,
  transform,
  numericalAperture,
}: { api: ViewerApi | null; surface: HTMLElement | null } & Pick<MicrographViewerProps, "umPerPx" | "transform" | "numericalAperture">) {
  return (
    <>
      <div className="absolute bottom-2 left-2 z-20 flex flex-col items-start gap-1">
        <ResolutionNote umPerPx={umPerPx} numericalAperture={numericalAperture} />
        <ScaleBar api={api} umPerPx={umPerPx} />
      </div>
      <div className="pointer-events-none absolute bottom-2 left-1/2 z-20 -translate-x-1/2">
        <CursorReadout api={api} surface={surface} transform={transform} />
      </div>
    </>
  );
}

function ViewerStatusNote({ status }: { status: ReturnType<typeof useOsdViewer>["status"] }) {
  if (status.state === "ready") return null;
  return (
    <div className="pointer-events-none absolute inset-0 z-20 flex items-center justify-center">
      {status.state === "failed" ? (
        <p role="alert" className="rounded-md bg-ink-900 px-3 py-2 text-sm text-danger-400">
          The micrograph could not be shown: {status.message}
        </p>
      ) : (
        <p role="status" className="rounded-md bg-ink-900/80 px-3 py-2 text-sm text-ink-300">
          Loading micrograph…
        </p>
      )}
    </div>
  );
}
