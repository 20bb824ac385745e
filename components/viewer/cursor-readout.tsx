"use client";

import { useEffect, useState } from "react";
import type { Affine2x3 } from "@/lib/geometry/types";
import { cursorReading } from "./cursor-format";
import { useViewVersion } from "./use-view-version";
import type { ViewerApi, XY } from "./viewer-api";

/**
 * Where the cursor is, in die-frame µm (image px while the micrograph has no transform).
 * It listens on surface, the element that holds the canvas and its overlays, so positions over
 * markup count too; it re-reads on view changes because a still cursor moves over the image.
 */
export function CursorReadout({ api, surface, transform }: { api: ViewerApi | null; surface: HTMLElement | null; transform: Affine2x3 | null }) {
  const [screen, setScreen] = useState<XY | null>(null);
  useViewVersion(api);

  useEffect(() => {
    if (!surface || !api) return;
    const move = (e: PointerEvent) => {
      const overNavigator = e.target instanceof Node && api.viewer.navigator?.element.contains(e.target);
      const r = api.viewer.element.getBoundingClientRect();
      setScreen(overNavigator ? null : { x: e.clientX - r.left, y: e.clientY - r.top });
    };
    const leave = () => setScreen(null);
    surface.addEventListener("pointermove", move);
    surface.addEventListener("pointerleave", leave);
    return () => {
      surface.removeEventListener("pointermove", move);
      surface.removeEventListener("pointerleave", leave);
    };
  }, [surface, api]);

  const reading = api && screen ? cursorReading(api.screenToImage(screen.x, screen.y), transform) : null;
  return (
    <div
      data-testid="cursor-readout"
      data-unit={reading?.unit ?? (transform ? "µm" : "px")}
      data-x={reading?.x}
      data-y={reading?.y}
      aria-live="off"
      className="pointer-events-none select-none rounded-md bg-ink-950/80 px-2 py-1 font-mono text-xs tabular-nums text-ink-200"
    >
      {reading ? reading.text : transform ? "x — µm · y — µm" : "x — px · y — px"}
    </div>
  );
}
