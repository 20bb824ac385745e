import type { Affine2x3, Position } from "@/lib/geometry/types";
import type { AnyShape, PadProperties } from "@/lib/markup/types";
import { HALO_COLOUR, KIND_STYLE, PAD_STATE_STYLE } from "../palette";
import { bondedPadIds, shownPadState } from "@/lib/markup/pad-state";
import { screenPxPerUm } from "./die-to-screen";
import { polylineLength } from "@/lib/geometry/measure";
import { formatUm } from "@/lib/units/format-um";

export type DrawOptions = {
  /** Die µm → screen CSS px. */
  matrix: Affine2x3;
  /** Device pixels per CSS px, for sharp lines on high-DPI screens. */
  pixelRatio: number;
  /** The visible die rectangle [minX, minY, maxX, maxY], for culling. */
  visibleUm: [number, number, number, number];
  labels: boolean;
  /** Bounding boxes by shape id, precomputed once per model change. */
  bboxes: ReadonlyMap<string, [number, number, number, number]>;
  /** Scale of the micrograph shown (µm per image px): how many decimals lengths get. */
  umPerPx?: number | null;
};

function pathOf(ctx: CanvasRenderingContext2D, m: Affine2x3, pts: readonly Position[], close: boolean) {
  ctx.beginPath();
  pts.forEach(([x, y], i) => {
    const sx = m[0][0] * x + m[0][1] * y + m[0][2];
    const sy = m[1][0] * x + m[1][1] * y + m[1][2];
    if (i === 0) ctx.moveTo(sx, sy);
    else ctx.lineTo(sx, sy);
  });
  if (close) ctx.closePath();
}

function strokeWithHalo(ctx: CanvasRenderingContext2D, colour: string, width: number, dash?: number[]) {
  ctx.setLineDash([]);
  ctx.strokeStyle = HALO_COLOUR;
  ctx.lineWidth = width + 2;
  ctx.stroke();
  ctx.setLineDash(dash ?? []);
  ctx.strokeStyle = colour;
  ctx.lineWidth = width;
  ctx.stroke();
}

/** The label drawn beside a shape, per kind; a ruler shows its length ("gate pitch: 12.5 µm"). */
export function labelOf(s: AnyShape, umPerPx?: number | null): string {
  const p = s.properties as Record<string, unknown>;
  const label = String(p.label ?? p.name ?? p.text ?? "");
  if (s.kind === "ruler" && s.geometry.type === "LineString") {
    const length = `${formatUm(polylineLength(s.geometry.coordinates), umPerPx)} µm`;
    return label.trim() ? `${label}: ${length}` : length;
  }
  return label;
}

/** Draws one shape in screen space (positions mapped by hand, so strokes keep a constant width). */
export function drawShape(ctx: CanvasRenderingContext2D, s: AnyShape, m: Affine2x3, widthPx = 1.5) {
  const style = KIND_STYLE[s.kind];
  const g = s.geometry;
  if (g.type === "Point") {
    const [x, y] = g.coordinates;
    const sx = m[0][0] * x + m[0][1] * y + m[0][2];
    const sy = m[1][0] * x + m[1][1] * y + m[1][2];
    ctx.beginPath();
    ctx.arc(sx, sy, 5, 0, Math.PI * 2);
    ctx.fillStyle = style.colour;
    ctx.fill();
    strokeWithHalo(ctx, "#000", 1);
    return;
  }
  if (g.type === "LineString") {
    pathOf(ctx, m, g.coordinates, false);
    const trace = s.kind === "trace" ? (s.properties as { widthUm?: number }).widthUm : undefined;
    // A trace is drawn at its real width once that is wider than a hairline.
    const w = trace ? Math.max(widthPx, trace * screenPxPerUm(m)) : widthPx;
    if (trace && w > widthPx) {
      ctx.globalAlpha = 0.35;
      ctx.strokeStyle = style.colour;
      ctx.lineWidth = w;
      ctx.lineCap = "round";
      ctx.lineJoin = "round";
      ctx.setLineDash([]);
      ctx.stroke();
      ctx.globalAlpha = 1;
      strokeWithHalo(ctx, style.colour, widthPx);
    } else strokeWithHalo(ctx, style.colour, w, style.dash);
    return;
  }
  pathOf(ctx, m, g.coordinates[0], true);
  if (s.kind === "pad") {
    const st = PAD_STATE_STYLE[(s.properties as PadProperties).state] ?? PAD_STATE_STYLE.bonded;
    if (st.fillAlpha > 0) {
      ctx.globalAlpha = st.fillAlpha;
      ctx.fillStyle = style.colour;
      ctx.fill();
      ctx.globalAlpha = 1;
    }
    strokeWithHalo(ctx, style.colour, widthPx, st.dash);
    return;
  }
  if (s.kind === "block") {
    ctx.globalAlpha = 0.08;
    ctx.fillStyle = style.colour;
    ctx.fill();
    ctx.globalAlpha = 1;
  }
  strokeWithHalo(ctx, style.colour, widthPx, style.dash);
}

function visible(b: [number, number, number, number] | undefined, v: DrawOptions["visibleUm"]) {
  return !b || !(b[2] < v[0] || b[0] > v[2] || b[3] < v[1] || b[1] > v[3]);
}

type Batch = { path: Path2D; colour: string; dash?: number[]; fillAlpha: number };

function addPath(path: Path2D, m: Affine2x3, pts: readonly Position[], close: boolean) {
  pts.forEach(([x, y], i) => {
    const sx = m[0][0] * x + m[0][1] * y + m[0][2];
    const sy = m[1][0] * x + m[1][1] * y + m[1][2];
    if (i === 0) path.moveTo(sx, sy);
    else path.lineTo(sx, sy);
  });
  if (close) path.closePath();
}

/** The batch a shape's outline joins: one per kind and look, so thousands of shapes are a few strokes. */
function batchKey(s: AnyShape, bonded: ReadonlySet<string>): { key: string; colour: string; dash?: number[]; fillAlpha: number } {
  const style = KIND_STYLE[s.kind];
  if (s.kind === "pad") {
    // The state shown: from the pad's wire bonds unless set by hand.
    const state = shownPadState(s, bonded);
    const st = PAD_STATE_STYLE[state] ?? PAD_STATE_STYLE.bonded;
    return { key: `pad:${state}`, colour: style.colour, dash: st.dash, fillAlpha: st.fillAlpha };
  }
  return { key: s.kind, colour: style.colour, dash: style.dash, fillAlpha: s.kind === "block" ? 0.08 : 0 };
}

/** Where a label goes in die µm: a pad's or block's middle, a ruler's midpoint, else the top. */
function labelAnchor(s: AnyShape, b: readonly [number, number, number, number]): Position {
  if (s.kind === "ruler" && s.geometry.type === "LineString") {
    const pts = s.geometry.coordinates;
    const [a, z] = [pts[0], pts[pts.length - 1]];
    return [(a[0] + z[0]) / 2, (a[1] + z[1]) / 2];
  }
  return [(b[0] + b[2]) / 2, s.kind === "pad" || s.kind === "block" ? (b[1] + b[3]) / 2 : b[3]];
}

function drawLabels(ctx: CanvasRenderingContext2D, shapes: readonly AnyShape[], o: DrawOptions) {
  const m = o.matrix;
  const pxPerUm = screenPxPerUm(m);
  ctx.font = "600 11px var(--font-inter), system-ui, sans-serif";
  ctx.textAlign = "center";
  ctx.textBaseline = "middle";
  ctx.lineWidth = 3;
  ctx.setLineDash([]);
  for (const s of shapes) {
    const b = o.bboxes.get(s.id)!;
    const text = labelOf(s, o.umPerPx);
    const sizePx = Math.max(b[2] - b[0], b[3] - b[1]) * pxPerUm;
    // Notes and rulers always carry their text: a ruler is drawn to be read.
    if (!text || (s.kind !== "note" && s.kind !== "ruler" && sizePx < 18)) continue;
    const [cx, cy] = labelAnchor(s, b);
    const sx = m[0][0] * cx + m[0][1] * cy + m[0][2];
    const sy = m[1][0] * cx + m[1][1] * cy + m[1][2] - (s.kind === "note" || s.kind === "ruler" ? 12 : 0);
    ctx.strokeStyle = HALO_COLOUR;
    ctx.strokeText(text, sx, sy);
    ctx.fillStyle = KIND_STYLE[s.kind].colour;
    ctx.fillText(text, sx, sy);
  }
}

/**
 * Draws every visible shape of the model. Shapes off screen are culled by bounding box;
 * outlines of the same kind and look are batched into one path (a halo stroke, a fill and a
 * colour stroke per batch), so thousands of shapes cost a handful of canvas calls; wide traces
 * and notes are drawn one by one. Labels appear only once a shape is big enough on screen to
 * carry one (level of detail).
 */
export function drawMarkup(ctx: CanvasRenderingContext2D, shapes: Iterable<AnyShape>, o: DrawOptions): void {
  const m = o.matrix;
  const pxPerUm = screenPxPerUm(m);
  const batches = new Map<string, Batch>();
  const dots = new Map<string, Path2D>();
  const singles: AnyShape[] = [];
  const shown: AnyShape[] = [];
  const all = Array.isArray(shapes) ? (shapes as readonly AnyShape[]) : [...shapes];
  const bonded = bondedPadIds(all);
  for (const s of all) {
    const b = o.bboxes.get(s.id);
    if (!visible(b, o.visibleUm)) continue;
    shown.push(s);
    const g = s.geometry;
    // Level of detail: a shape under 5 px on screen is drawn as a filled dot of its colour.
    if (b && g.type !== "Point" && Math.max(b[2] - b[0], b[3] - b[1]) * pxPerUm < 5) {
      const colour = KIND_STYLE[s.kind].colour;
      let dot = dots.get(colour);
      if (!dot) dots.set(colour, (dot = new Path2D()));
      const sx = m[0][0] * b[0] + m[0][1] * b[3] + m[0][2];
      const sy = m[1][0] * b[0] + m[1][1] * b[3] + m[1][2];
      const w = Math.max(2, (b[2] - b[0]) * pxPerUm);
      const h = Math.max(2, (b[3] - b[1]) * pxPerUm);
      dot.rect(Math.min(sx, sx + w), Math.min(sy, sy + h), w, h);
      continue;
    }
    const wide = s.kind === "trace" && ((s.properties as { widthUm?: number }).widthUm ?? 0) * pxPerUm > 1.5;
    if (g.type === "Point" || wide) {
      singles.push(s);
      continue;
    }
    const k = batchKey(s, bonded);
    let batch = batches.get(k.key);
    if (!batch) batches.set(k.key, (batch = { path: new Path2D(), colour: k.colour, dash: k.dash, fillAlpha: k.fillAlpha }));
    if (g.type === "LineString") addPath(batch.path, m, g.coordinates, false);
    else addPath(batch.path, m, g.coordinates[0], true);
  }
  ctx.lineCap = "butt";
  for (const b of batches.values()) {
    if (b.fillAlpha > 0) {
      ctx.globalAlpha = b.fillAlpha;
      ctx.fillStyle = b.colour;
      ctx.fill(b.path);
      ctx.globalAlpha = 1;
    }
    ctx.setLineDash([]);
    ctx.strokeStyle = HALO_COLOUR;
    ctx.lineWidth = 3.5;
    ctx.stroke(b.path);
    ctx.setLineDash(b.dash ?? []);
    ctx.strokeStyle = b.colour;
    ctx.lineWidth = 1.5;
    ctx.stroke(b.path);
  }
  ctx.setLineDash([]);
  for (const [colour, dot] of dots) {
    ctx.fillStyle = colour;
    ctx.fill(dot);
  }
  for (const s of singles) drawShape(ctx, s, m);
  if (o.labels) drawLabels(ctx, shown, o);
}
