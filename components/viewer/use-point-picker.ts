"use client";

import { useEffect, useRef } from "react";
import type OpenSeadragon from "openseadragon";
import type { ViewerApi } from "./viewer-api";

/** CSS px of a click relative to the viewer element (OpenSeadragon's position is the canvas'). */
function clientPoint(e: OpenSeadragon.CanvasClickEvent, element: HTMLElement): [number, number] {
  const o = e.originalEvent;
  if (o instanceof MouseEvent) {
    const r = element.getBoundingClientRect();
    return [o.clientX - r.left, o.clientY - r.top];
  }
  return [e.position.x, e.position.y];
}

/**
 * Calls onPick with the full-resolution image px of each quick click (not the end of a drag,
 * which pans) on the viewer, while enabled. Double clicks do not zoom while picking.
 */
export function usePointPicker(api: ViewerApi | null, enabled: boolean, onPick: (p: [number, number]) => void): void {
  const pick = useRef(onPick);
  useEffect(() => {
    pick.current = onPick;
  });
  useEffect(() => {
    if (!api || !enabled) return;
    const viewer = api.viewer;
    const click = (e: OpenSeadragon.CanvasClickEvent) => {
      e.preventDefaultAction = true;
      if (!e.quick) return;
      const [sx, sy] = clientPoint(e, viewer.element);
      const p = api.screenToImage(sx, sy);
      if (Number.isFinite(p.x) && Number.isFinite(p.y)) pick.current([p.x, p.y]);
    };
    const dbl = (e: OpenSeadragon.CanvasDoubleClickEvent) => {
      e.preventDefaultAction = true;
    };
    viewer.addHandler("canvas-click", click);
    viewer.addHandler("canvas-double-click", dbl);
    // The viewer's canvas is a DOM node outside React: set its cursor through the style API.
    const style = viewer.canvas.style;
    const cursor = style.getPropertyValue("cursor");
    style.setProperty("cursor", "crosshair");
    return () => {
      viewer.removeHandler("canvas-click", click);
      viewer.removeHandler("canvas-double-click", dbl);
      style.setProperty("cursor", cursor);
    };
  }, [api, enabled]);
}
