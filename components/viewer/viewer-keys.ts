import type OpenSeadragon from "openseadragon";
import type { OsdNamespace } from "./viewer-api";

/** What a viewer key or toolbar button does; pan steps are fractions of the viewer's size. */
export type ViewerAction = { kind: "zoom"; factor: number } | { kind: "home" } | { kind: "pan"; dx: number; dy: number };

/** One press zooms by this factor: big enough to feel, small enough to keep one's place. */
export const ZOOM_STEP = 1.5;
const PAN_STEP = 0.15;

const KEYS: Record<string, ViewerAction> = {
  "+": { kind: "zoom", factor: ZOOM_STEP },
  "=": { kind: "zoom", factor: ZOOM_STEP },
  "-": { kind: "zoom", factor: 1 / ZOOM_STEP },
  _: { kind: "zoom", factor: 1 / ZOOM_STEP },
  "0": { kind: "home" },
  ArrowLeft: { kind: "pan", dx: -PAN_STEP, dy: 0 },
  ArrowRight: { kind: "pan", dx: PAN_STEP, dy: 0 },
  ArrowUp: { kind: "pan", dx: 0, dy: -PAN_STEP },
  ArrowDown: { kind: "pan", dx: 0, dy: PAN_STEP },
};

/** The action for a key (KeyboardEvent.key), or null when the viewer does not use it. */
export function viewerActionForKey(key: string): ViewerAction | null {
  return Object.hasOwn(KEYS, key) ? KEYS[key] : null;
}

/** True when a key event belongs to a form control inside the viewer, not to the viewer. */
export function isTypingTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName);
}

/** Applies an action to the viewer with OpenSeadragon's smooth springs. */
export function runViewerAction(osd: OsdNamespace, viewer: OpenSeadragon.Viewer, action: ViewerAction): void {
  const viewport = viewer.viewport;
  if (action.kind === "zoom") viewport.zoomBy(action.factor);
  else if (action.kind === "home") viewport.goHome();
  else {
    const size = viewport.getContainerSize();
    viewport.panBy(viewport.deltaPointsFromPixels(new osd.Point(action.dx * size.x, action.dy * size.y)));
  }
  viewport.applyConstraints();
}
