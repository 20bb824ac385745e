import { applyAffine } from "@/lib/geometry/affine";
import { geometryCentre } from "@/lib/geometry/measure";
import type { Affine2x3, Position } from "@/lib/geometry/types";
import { HALO_COLOUR, KIND_STYLE, PAD_STATE_STYLE } from "@/lib/markup/palette";
import { shapeLabel } from "@/lib/markup/markup-table";
import type { AnyShape } from "@/lib/markup/types";
import { textWidthPx } from "@/lib/fonts/app-fonts";
import { clip, n2, xmlEscape } from "./svg-text";

/** Sizes of strokes and text in output pixels, scaled with the output's width. */
export type MarkupStyle = { readonly stroke: number; readonly fontPx: number };

/** Strokes stay readable from a 1,000-px thumbnail to a 16,384-px poster. */
export function markupStyle(outputWidth: number): MarkupStyle {
  const stroke = Math.max(1.5, Math.min(12, outputWidth / 800));
  return { stroke, fontPx: Math.max(11, Math.min(96, outputWidth / 90)) };
}

/** A thread marker to draw: where (die µm) and whether it is still open. */
export type ThreadMark = { readonly at: Position; readonly open: boolean; readonly number: number };

function points(m: Affine2x3, ps: readonly Position[]): string {
  return ps.map(([x, y]) => applyAffine(m, x, y).map(n2).join(",")).join(" ");
}

function ringsPath(m: Affine2x3, rings: readonly (readonly Position[])[]): string {
  return rings.map((r) => `M${points(m, r).replace(/ /g, "L")}Z`).join("");
}

function hexAlpha(hex: string, alpha: number): string {
  const v = parseInt(hex.slice(1), 16);
  return `rgba(${(v >> 16) & 255},${(v >> 8) & 255},${v & 255},${alpha})`;
}

/** One shape as SVG: a dark halo under a coloured stroke, as on screen. */
export function shapeSvg(shape: AnyShape, m: Affine2x3, style: MarkupStyle): string {
  const ks = KIND_STYLE[shape.kind];
  const sw = style.stroke;
  const dashFor = (dash?: number[]) => (dash ? ` stroke-dasharray="${dash.map((d) => n2((d * sw) / 2)).join(" ")}"` : "");
  const g = shape.geometry;
  if (g.type === "Point") {
    const [x, y] = applyAffine(m, g.coordinates[0], g.coordinates[1]);
    const r = sw * 3;
    return `<circle cx="${n2(x)}" cy="${n2(y)}" r="${n2(r)}" fill="${ks.colour}" stroke="${HALO_COLOUR}" stroke-width="${n2(sw)}"/>`;
  }
  if (g.type === "LineString") {
    const pts = points(m, g.coordinates);
    const width = shape.kind === "wire_bond" ? sw * 1.5 : sw;
    const common = `points="${pts}" fill="none" stroke-linejoin="round" stroke-linecap="round"`;
    return `<polyline ${common} stroke="${HALO_COLOUR}" stroke-width="${n2(width + sw)}"/><polyline ${common} stroke="${ks.colour}" stroke-width="${n2(width)}"${dashFor(ks.dash)}/>`;
  }
  const d = ringsPath(m, g.coordinates);
  const pad = shape.kind === "pad" ? PAD_STATE_STYLE[(shape.properties as { state?: keyof typeof PAD_STATE_STYLE }).state ?? "unbonded"] : undefined;
  const fill = pad && pad.fillAlpha > 0 ? hexAlpha(ks.colour, pad.fillAlpha) : "none";
  const dash = pad?.dash ?? ks.dash;
  return `<path d="${d}" fill="none" stroke="${HALO_COLOUR}" stroke-width="${n2(sw * 2)}" fill-rule="evenodd"/><path d="${d}" fill="${fill}" stroke="${ks.colour}" stroke-width="${n2(sw)}" fill-rule="evenodd"${dashFor(dash)}/>`;
}

/** Opacity of the dark plate under each label. */
const LABEL_PLATE_OPACITY = 0.62;

/**
 * A shape's label centred on it, on a dark rounded plate so it reads on any background. A
 * plate rather than a stroked halo: librsvg strokes text by converting it to outlines, three
 * times the cost of filling it, and an export may carry thousands of labels.
 */
export function labelSvg(shape: AnyShape, m: Affine2x3, style: MarkupStyle): string {
  const box = labelBox(shape, m, style);
  if (!box) return "";
  const f = style.fontPx;
  const plate = `<rect x="${n2(box.x)}" y="${n2(box.y)}" width="${n2(box.width)}" height="${n2(box.height)}" rx="${n2(f * 0.25)}" fill="#000" fill-opacity="${LABEL_PLATE_OPACITY}"/>`;
  return `${plate}<text x="${n2(box.x + f * 0.25)}" y="${n2(box.baseline)}" font-size="${n2(f)}" fill="${KIND_STYLE[shape.kind].colour}">${xmlEscape(box.text)}</text>`;
}

/** Where a shape's label plate goes in output px (null when it has no label). */
export function labelBox(shape: AnyShape, m: Affine2x3, style: MarkupStyle): { text: string; x: number; y: number; width: number; height: number; baseline: number } | null {
  const text = clip(shapeLabel(shape), 40);
  if (!text) return null;
  const [cx, cy] = geometryCentre(shape.geometry);
  const [x, y] = applyAffine(m, cx, cy);
  const f = style.fontPx;
  // Baseline: centred on the shape, or above a point marker.
  const baseline = shape.geometry.type === "Point" ? y - style.stroke * 4 - f * 0.3 : y + f * 0.35;
  const width = measured(text, f) + f * 0.5;
  return { text, x: x - width / 2, y: baseline - f, width, height: f * 1.3, baseline };
}

/** Label widths, remembered: a label crossing tiles is measured once. */
const widths = new Map<string, number>();
function measured(text: string, f: number): number {
  const key = `${f}|${text}`;
  let w = widths.get(key);
  if (w === undefined) {
    if (widths.size > 50_000) widths.clear();
    w = textWidthPx(text, f);
    widths.set(key, w);
  }
  return w;
}

/** A numbered marker for a review thread (filled when open, hollow when resolved). */
export function threadSvg(t: ThreadMark, m: Affine2x3, style: MarkupStyle): string {
  const [x, y] = applyAffine(m, t.at[0], t.at[1]);
  const r = style.fontPx * 0.75;
  const fill = t.open ? "#ffffff" : "none";
  const colour = t.open ? "#111111" : "#ffffff";
  return `<circle cx="${n2(x)}" cy="${n2(y)}" r="${n2(r)}" fill="${fill}" stroke="#111" stroke-width="${n2(style.stroke)}"/><text x="${n2(x)}" y="${n2(y + r * 0.4)}" font-size="${n2(r * 1.1)}" text-anchor="middle" fill="${colour}">${t.number}</text>`;
}

/**
 * Everything drawn over the image area: shapes first (in creation order), then labels on top
 * of all shapes, then thread markers.
 */
export function markupLayerSvg(shapes: readonly AnyShape[], m: Affine2x3, width: number, opts: { labels: boolean; threads: readonly ThreadMark[] }): string {
  const style = markupStyle(width);
  const parts = shapes.map((s) => shapeSvg(s, m, style));
  if (opts.labels) parts.push(...shapes.map((s) => labelSvg(s, m, style)));
  parts.push(...opts.threads.map((t) => threadSvg(t, m, style)));
  return parts.join("");
}
