import { applyAffine } from "@/lib/geometry/affine";
import { geometryCentre, polylineLength } from "@/lib/geometry/measure";
import { formatUm } from "@/lib/units/format-um";
import { wrapText } from "./wrap-text";
import type { Affine2x3, Position } from "@/lib/geometry/types";
import { HALO_COLOUR, KIND_STYLE, PAD_STATE_STYLE } from "@/lib/markup/palette";
import { shapeLabel } from "@/lib/markup/markup-table";
import type { AnyShape } from "@/lib/markup/types";
import { textWidthPx } from "@/lib/fonts/app-fonts";
import { clip, n2, xmlEscape } from "./svg-text";
import {
  REMARK_MARKER_PROPORTIONS,
  REMARK_MARKER_SIZES,
  REMARK_MARKER_STYLES,
  remarkMarkerPath,
  remarkMarkerShape,
  type RemarkMarkerShape,
} from "@/lib/markup/remark-marker";

/** Sizes of strokes and text in output pixels, scaled with the output's width. */
export type MarkupStyle = { readonly stroke: number; readonly fontPx: number };

/** Strokes stay readable from a 1,000-px thumbnail to a 16,384-px poster. */
export function markupStyle(outputWidth: number): MarkupStyle {
  const stroke = Math.max(1.5, Math.min(12, outputWidth / 800));
  return { stroke, fontPx: Math.max(11, Math.min(96, outputWidth / 90)) };
}

/** A remark marker to draw: where (die µm) and whether the remark is still open. */
export type ThreadMark = {
  readonly at: Position;
  readonly open: boolean;
  readonly number: number;
  /** Output px the marker was moved from its anchor to keep it off labels (a leader joins them). */
  readonly offsetPx?: readonly [number, number];
};

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
/** A note's text wraps at this many font sizes wide; other labels stay on one line. */
const NOTE_WRAP_EM = 22;
const LINE_HEIGHT = 1.25;

/** Output µm per pixel of a die → output map (its linear part is a uniform scale). */
const umPerPxOf = (m: Affine2x3) => 1 / Math.hypot(m[0][0], m[1][0]);

/**
 * The text a shape carries in an export: a ruler its length (with its label when it has one),
 * in the decimals the output scale resolves; a note its whole text; others their label.
 */
function exportLabelText(shape: AnyShape, m: Affine2x3): string {
  if (shape.kind === "ruler" && shape.geometry.type === "LineString") {
    const length = `${formatUm(polylineLength(shape.geometry.coordinates), umPerPxOf(m))} µm`;
    const label = shapeLabel(shape).trim();
    return label ? `${clip(label, 40)}: ${length}` : length;
  }
  if (shape.kind === "note") return shapeLabel(shape).trim();
  return clip(shapeLabel(shape), 40);
}

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
  const colour = KIND_STYLE[shape.kind].colour;
  const texts = box.lines.map(
    (line, i) =>
      `<text x="${n2(box.x + f * 0.25)}" y="${n2(box.baseline + i * f * LINE_HEIGHT)}" font-size="${n2(f)}" fill="${colour}">${xmlEscape(line)}</text>`,
  );
  return plate + texts.join("");
}

/** Where a shape's label plate goes in output px (null when it has no label). */
export function labelBox(
  shape: AnyShape,
  m: Affine2x3,
  style: MarkupStyle,
): { lines: string[]; x: number; y: number; width: number; height: number; baseline: number } | null {
  const text = exportLabelText(shape, m);
  if (!text) return null;
  const f = style.fontPx;
  const lines = shape.kind === "note" ? wrapText(text, NOTE_WRAP_EM * f, (t) => measured(t, f)).filter((l, i, all) => l !== "" || i < all.length - 1) : [text];
  const [cx, cy] = geometryCentre(shape.geometry);
  const [x, y] = applyAffine(m, cx, cy);
  const width = Math.max(...lines.map((l) => measured(l, f))) + f * 0.5;
  const height = f * 0.3 + lines.length * f * LINE_HEIGHT - (LINE_HEIGHT - 1) * f;
  // A point's text sits above its marker (growing upwards); others are centred on the shape.
  const top = shape.geometry.type === "Point" ? y - style.stroke * 4 - height : y - height / 2;
  return { lines, x: x - width / 2, y: top, width, height, baseline: top + f };
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

/** A remark marker at the export's scale: the same tag as on screen, sized from the label font. */
export const remarkMarkShape = (t: ThreadMark, style: MarkupStyle): RemarkMarkerShape =>
  remarkMarkerShape(style.fontPx * REMARK_MARKER_SIZES.exportPerFontPx, t.number);

type Box = readonly [number, number, number, number];

/**
 * Remark markers moved off every label plate and off each other: a marker that would cover a
 * label goes straight up to just above it, as often as needed, and keeps a leader line from the
 * place it marks to its tail's tip. Done once for the whole output so a marker crossing tiles
 * lands the same in each.
 */
export function placeThreadMarks(threads: readonly ThreadMark[], shapes: readonly AnyShape[], m: Affine2x3, style: MarkupStyle, labels: boolean): ThreadMark[] {
  const obstacles: Box[] = labels
    ? shapes.flatMap((s) => {
        const b = labelBox(s, m, style);
        return b ? [[b.x, b.y, b.x + b.width, b.y + b.height] as const] : [];
      })
    : [];
  const pad = style.stroke / 2;
  return threads.map((t) => {
    const { box } = remarkMarkShape(t, style);
    const [ax, ay] = applyAffine(m, t.at[0], t.at[1]);
    const [x0, x1] = [ax + box.minX - pad, ax + box.maxX + pad];
    let y = ay;
    for (let i = 0; i < 100; i++) {
      const hit = obstacles.find((b) => x1 > b[0] && x0 < b[2] && y + box.maxY + pad > b[1] && y + box.minY - pad < b[3]);
      if (!hit) break;
      y = hit[1] - box.maxY - pad - style.stroke;
    }
    obstacles.push([x0, y + box.minY - pad, x1, y + box.maxY + pad]);
    return y === ay ? t : { ...t, offsetPx: [0, y - ay] as const };
  });
}

/**
 * The leader of a moved remark marker: a line from the place it marks to the marker's tip, and a
 * dot there. Drawn under the labels, so the plate it was moved off stays readable.
 */
function threadLeaderSvg(t: ThreadMark, m: Affine2x3, style: MarkupStyle): string {
  if (!t.offsetPx) return "";
  const [ax, ay] = applyAffine(m, t.at[0], t.at[1]);
  const x = ax + t.offsetPx[0];
  const y = ay + t.offsetPx[1];
  return `<line x1="${n2(ax)}" y1="${n2(ay)}" x2="${n2(x)}" y2="${n2(y)}" stroke="#fff" stroke-width="${n2(style.stroke)}"/><circle cx="${n2(ax)}" cy="${n2(ay)}" r="${n2(style.stroke * 1.5)}" fill="#fff" stroke="#111" stroke-width="${n2(style.stroke / 2)}"/>`;
}

/** A remark's numbered marker (lib/markup/remark-marker.ts, as on screen): tail tip on its anchor, or on its leader's end. */
function remarkMarkSvg(t: ThreadMark, m: Affine2x3, style: MarkupStyle): string {
  const [ax, ay] = applyAffine(m, t.at[0], t.at[1]);
  const x = ax + (t.offsetPx?.[0] ?? 0);
  const y = ay + (t.offsetPx?.[1] ?? 0);
  const shape = remarkMarkShape(t, style);
  const s = REMARK_MARKER_STYLES[t.open ? "open" : "closed"];
  const { label } = shape;
  return `<path d="${remarkMarkerPath(shape, x, y)}" fill="${s.plate}" stroke="${s.edge}" stroke-width="${n2(shape.edgePx)}" stroke-linejoin="miter"/><text x="${n2(x + label.x)}" y="${n2(y + label.y + label.fontPx * REMARK_MARKER_PROPORTIONS.numberBaselineEm)}" font-size="${n2(label.fontPx)}" font-weight="bold" text-anchor="middle" fill="${s.number}">${t.number}</text>`;
}

/**
 * Everything drawn over the image area: shapes first (in creation order), the leaders of moved
 * remark markers, labels on top of all that, then the remark markers.
 */
export function markupLayerSvg(shapes: readonly AnyShape[], m: Affine2x3, width: number, opts: { labels: boolean; threads: readonly ThreadMark[] }): string {
  const style = markupStyle(width);
  const parts = shapes.map((s) => shapeSvg(s, m, style));
  parts.push(...opts.threads.map((t) => threadLeaderSvg(t, m, style)));
  if (opts.labels) parts.push(...shapes.map((s) => labelSvg(s, m, style)));
  parts.push(...opts.threads.map((t) => remarkMarkSvg(t, m, style)));
  return parts.join("");
}
