import { applyAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { REMARK_MARKER_SIZES, REMARK_MARKER_STYLES, remarkMarkerShape, remarkMarkerState } from "@/lib/markup/remark-marker";
import type { OverlayDrawer } from "@/components/annotate/markup-overlay";

/** Outline of the selected remark's marker, over its own edge. */
const SELECTED_EDGE = "#ffffff";

/**
 * Draws each remark's marker (lib/markup/remark-marker.ts, the same tag the exports print) with
 * its tail's tip on the remark's anchor, in screen px through the die → screen matrix.
 */
export function remarkMarkersDrawer(
  remarks: readonly { id: string; pin: readonly [number, number]; status: "open" | "resolved" }[],
  selectedId: string | null,
): OverlayDrawer {
  return (ctx: CanvasRenderingContext2D, matrix: Affine2x3) => {
    ctx.save();
    remarks.forEach((t, i) => {
      const [x, y] = applyAffine(matrix, t.pin[0], t.pin[1]);
      if (!Number.isFinite(x) || !Number.isFinite(y)) return;
      const selected = t.id === selectedId;
      const shape = remarkMarkerShape(REMARK_MARKER_SIZES.screenPx * (selected ? REMARK_MARKER_SIZES.selectedScale : 1), i + 1);
      const style = REMARK_MARKER_STYLES[remarkMarkerState(t.status)];
      ctx.beginPath();
      shape.outline.forEach(([px, py], k) => (k === 0 ? ctx.moveTo(x + px, y + py) : ctx.lineTo(x + px, y + py)));
      ctx.closePath();
      ctx.fillStyle = style.plate;
      ctx.strokeStyle = selected ? SELECTED_EDGE : style.edge;
      ctx.lineWidth = Math.max(1.5, shape.edgePx);
      ctx.lineJoin = "miter";
      ctx.fill();
      ctx.stroke();
      ctx.fillStyle = style.number;
      ctx.font = `bold ${shape.label.fontPx}px sans-serif`;
      ctx.textAlign = "center";
      ctx.textBaseline = "middle";
      ctx.fillText(String(i + 1), x + shape.label.x, y + shape.label.y);
    });
    ctx.restore();
  };
}
