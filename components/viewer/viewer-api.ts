import type OpenSeadragon from "openseadragon";

/** The OpenSeadragon namespace as loaded at run time (it cannot be imported statically). */
export type OsdNamespace = typeof OpenSeadragon;

/** A plain pair of numbers; which space it is in is said by the function that returns it. */
export type XY = { x: number; y: number };

/**
 * What the viewer hands to overlays (markup layer, calibration, tools). Image coordinates are
 * always full-resolution pixels of the micrograph, whatever is being displayed (preview or
 * pyramid); screen coordinates are CSS pixels relative to the viewer's top-left corner.
 */
export type ViewerApi = {
  viewer: OpenSeadragon.Viewer;
  /** Full-resolution image px → CSS px of the viewer element, at the current (animating) view. */
  imageToScreen(x: number, y: number): XY;
  /** CSS px of the viewer element → full-resolution image px, at the current view. */
  screenToImage(x: number, y: number): XY;
  /** Screen px per full-resolution image px at the current view. */
  imageZoom(): number;
  /**
   * Zooms by factor keeping the image point under screen (x, y) in place, as the wheel does.
   * Callers must not build OpenSeadragon points themselves: its Point prototype is a plain
   * object, so `point.constructor` is Object and `new` on it gives a point without methods.
   */
  zoomAt(factor: number, x: number, y: number): void;
  /** Moves the view at once so the full-resolution image point (x, y) is at the centre. */
  centreOnImagePoint(x: number, y: number): void;
  /** Animates the view to show a rectangle given in full-resolution image px. */
  flyToImageRect(x: number, y: number, w: number, h: number): void;
  /** Calls cb whenever the view moves or resizes; returns the unsubscribe function. */
  onViewChange(cb: () => void): () => void;
};

/** Full-resolution size of the micrograph, read at call time so prop changes are seen. */
export type ImageSizeGetter = () => { width: number; height: number };

// 'update-viewport' follows every redraw and 'animation' every spring step, both after the
// springs moved, so reading the *current* viewport there keeps overlays in the same frame.
const VIEW_EVENTS = ["animation", "update-viewport", "resize", "rotate", "flip", "open"] as const;

/**
 * Ratio of the displayed source's pixels to full-resolution pixels. It is 1 for the pyramid
 * and about 2048 / width for the preview, which OpenSeadragon only knows at its own size.
 */
function sourceScale(viewer: OpenSeadragon.Viewer, size: ImageSizeGetter) {
  const item = viewer.world.getItemAt(0);
  if (!item) return null;
  const dims = item.source.dimensions;
  const { width, height } = size();
  if (!(width > 0 && height > 0 && dims.x > 0 && dims.y > 0)) return null;
  return { item, kx: dims.x / width, ky: dims.y / height };
}

/** OpenSeadragon mirrors the drawing about the container's vertical centre line when flipped. */
function mirrorX(viewer: OpenSeadragon.Viewer, x: number): number {
  return viewer.viewport.getFlip() ? viewer.viewport.getContainerSize().x - x : x;
}

/** Builds the one mapping between full-resolution image px and screen px for a viewer. */
export function createViewerApi(osd: OsdNamespace, viewer: OpenSeadragon.Viewer, size: ImageSizeGetter): ViewerApi {
  const listeners = new Set<() => void>();
  const notify = () => listeners.forEach((cb) => cb());
  for (const name of VIEW_EVENTS) viewer.addHandler(name, notify);

  const imageToScreen = (x: number, y: number): XY => {
    const s = sourceScale(viewer, size);
    if (!s) return { x: Number.NaN, y: Number.NaN };
    const vp = s.item.imageToViewportCoordinates(x * s.kx, y * s.ky, true);
    const px = viewer.viewport.pixelFromPoint(vp, true);
    return { x: mirrorX(viewer, px.x), y: px.y };
  };

  const screenToImage = (x: number, y: number): XY => {
    const s = sourceScale(viewer, size);
    if (!s) return { x: Number.NaN, y: Number.NaN };
    const vp = viewer.viewport.pointFromPixel(new osd.Point(mirrorX(viewer, x), y), true);
    const img = s.item.viewportToImageCoordinates(vp, true);
    return { x: img.x / s.kx, y: img.y / s.ky };
  };

  const imageZoom = (): number => {
    const w = size().width;
    const a = imageToScreen(0, 0);
    const b = imageToScreen(w, 0);
    return Math.hypot(b.x - a.x, b.y - a.y) / w;
  };

  const zoomAt = (factor: number, x: number, y: number): void => {
    if (!(factor > 0) || !Number.isFinite(x) || !Number.isFinite(y)) return;
    const vp = viewer.viewport;
    vp.zoomBy(factor, vp.pointFromPixel(new osd.Point(mirrorX(viewer, x), y), true));
    vp.applyConstraints();
  };

  const centreOnImagePoint = (x: number, y: number): void => {
    const s = sourceScale(viewer, size);
    if (!s || !Number.isFinite(x) || !Number.isFinite(y)) return;
    // The viewport centre is also the rotation (and flip) pivot, so this holds at any rotation.
    viewer.viewport.panTo(s.item.imageToViewportCoordinates(x * s.kx, y * s.ky, true), true);
  };

  const flyToImageRect = (x: number, y: number, w: number, h: number): void => {
    const s = sourceScale(viewer, size);
    if (!s) return;
    const rect = s.item.imageToViewportRectangle(x * s.kx, y * s.ky, w * s.kx, h * s.ky);
    viewer.viewport.fitBoundsWithConstraints(rect);
  };

  const onViewChange = (cb: () => void) => {
    listeners.add(cb);
    return () => {
      listeners.delete(cb);
    };
  };

  return { viewer, imageToScreen, screenToImage, imageZoom, zoomAt, centreOnImagePoint, flyToImageRect, onViewChange };
}
