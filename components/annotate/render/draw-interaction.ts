import type { Affine2x3 } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { handlesFor } from "../editor/handles";
import type { EditorState } from "../editor/types";
import { KIND_STYLE, SELECTION_COLOUR } from "../palette";
import { drawShape } from "./draw-markup";
import { formatUm } from "@/lib/units/format-um";

const toScreen = (m: Affine2x3, x: number, y: number) => [m[0][0] * x + m[0][1] * y + m[0][2], m[1][0] * x + m[1][1] * y + m[1][2]] as const;

/** Formats a length in µm for the live ruler reading (µm to the decimals the scale resolves). */
export function formatLength(um: number, umPerPx?: number | null): string {
  return um >= 1000 ? `${(um / 1000).toFixed(3)} mm` : `${formatUm(um, umPerPx ?? 0.1)} µm`;
}

/**
 * The interactive layer: hover and selection outlines, screen-sized handles, and the shape,
 * path or box being drawn (with the ruler's live length).
 */
export function drawInteraction(ctx: CanvasRenderingContext2D, state: EditorState, m: Affine2x3): void {
  const hover = state.hoverId ? state.shapes.get(state.hoverId) : undefined;
  if (hover && !state.selection.has(hover.id)) {
    ctx.globalAlpha = 0.6;
    drawShape(ctx, hover, m, 3);
    ctx.globalAlpha = 1;
  }
  for (const id of state.selection) {
    const s = state.shapes.get(id);
    if (!s) continue;
    drawShape(ctx, s, m, 2.5);
    if (state.canEdit && state.selection.size === 1) drawHandles(ctx, s, m);
  }
  const p = state.toolPreview;
  if (!p) return;
  if (p.type === "shape") {
    drawShape(ctx, { ...p.shape, id: "preview", version: 0, createdBy: null, updatedAt: "" } as AnyShape, m, 2);
  } else if (p.type === "box") {
    const [x0, y0] = toScreen(m, p.box.minX, p.box.maxY);
    const [x1, y1] = toScreen(m, p.box.maxX, p.box.minY);
    ctx.setLineDash([4, 3]);
    ctx.strokeStyle = SELECTION_COLOUR;
    ctx.lineWidth = 1;
    ctx.strokeRect(Math.min(x0, x1), Math.min(y0, y1), Math.abs(x1 - x0), Math.abs(y1 - y0));
    ctx.setLineDash([]);
  } else {
    const pts = p.cursor ? [...p.points, p.cursor] : p.points;
    ctx.beginPath();
    pts.forEach(([x, y], i) => {
      const [sx, sy] = toScreen(m, x, y);
      if (i === 0) ctx.moveTo(sx, sy);
      else ctx.lineTo(sx, sy);
    });
    ctx.strokeStyle = KIND_STYLE[p.kind].colour;
    ctx.lineWidth = 2;
    ctx.stroke();
    for (const [x, y] of p.points) {
      const [sx, sy] = toScreen(m, x, y);
      ctx.fillStyle = p.closesOnClick ? SELECTION_COLOUR : KIND_STYLE[p.kind].colour;
      ctx.fillRect(sx - 3, sy - 3, 6, 6);
    }
    if (p.kind === "ruler" && p.cursor) {
      const [sx, sy] = toScreen(m, p.cursor[0], p.cursor[1]);
      const text = formatLength(p.lengthUm);
      ctx.font = "600 12px var(--font-inter), system-ui, sans-serif";
      ctx.textAlign = "left";
      ctx.textBaseline = "bottom";
      ctx.lineWidth = 3;
      ctx.strokeStyle = "rgba(0,0,0,0.8)";
      ctx.strokeText(text, sx + 10, sy - 6);
      ctx.fillStyle = "#fff";
      ctx.fillText(text, sx + 10, sy - 6);
    }
  }
}

function drawHandles(ctx: CanvasRenderingContext2D, s: AnyShape, m: Affine2x3) {
  for (const h of handlesFor(s)) {
    const [sx, sy] = toScreen(m, h.position[0], h.position[1]);
    ctx.fillStyle = "#14171a";
    ctx.strokeStyle = SELECTION_COLOUR;
    ctx.lineWidth = 1.5;
    ctx.fillRect(sx - 4, sy - 4, 8, 8);
    ctx.strokeRect(sx - 4, sy - 4, 8, 8);
  }
}
