import { createReadStream, createWriteStream } from "node:fs";
import { open, rm, stat } from "node:fs/promises";
import { pipeline } from "node:stream/promises";
import sharp, { type Sharp } from "sharp";
import { configureSharp, sharpInput } from "@/lib/tiles/limits";
import type { AnyShape, MarkupKind } from "@/lib/markup/types";
import { applyAffine } from "@/lib/geometry/affine";
import { boundingBox } from "@/lib/geometry/measure";
import type { Affine2x3 } from "@/lib/geometry/types";
import { footerSvg, formatScale, type PlacedScaleBar, type TitleBlock } from "./footer-svg";
import { markupLayerSvg, markupStyle, type ThreadMark } from "./markup-svg";
import { textChunk } from "./png-text";
import type { RenderPlan } from "./render-plan";

/**
 * Renders an annotated PNG with sharp in one streaming pipeline: the source window is cut from
 * the original (extract), mirrored if the transform mirrors, resized to the output scale,
 * trimmed and padded onto the output, extended by the footer, and the markup, legend, title
 * block and scale bar composited over it as one SVG. libvips evaluates this on demand in
 * strips, so memory stays near a few output rows whatever the source size.
 */

export type RenderInput = {
  readonly original: string | null;
  readonly pixelCap: number;
  readonly plan: RenderPlan;
  readonly shapes: readonly AnyShape[];
  readonly threads: readonly ThreadMark[];
  readonly labels: boolean;
  readonly title: TitleBlock;
};

export type RenderInfo = { readonly width: number; readonly height: number; readonly imageHeight: number; readonly scaleBar: PlacedScaleBar; readonly kinds: readonly MarkupKind[] };

const BACKGROUND = { r: 40, g: 44, b: 48 };

/** The source window placed on the output canvas (trimmed and padded), or a blank canvas. */
function imageLayer(input: RenderInput, footer: number): Sharp {
  const { plan, original } = input;
  const s = plan.source;
  const W = plan.width;
  const H = plan.height;
  if (!s || !original) {
    configureSharp();
    return sharp({ create: { width: W, height: H + footer, channels: 3, background: BACKGROUND } });
  }
  let img = sharpInput(original, input.pixelCap).extract({ left: s.left, top: s.top, width: s.width, height: s.height });
  if (s.flop) img = img.flop();
  if (s.flip) img = img.flip();
  img = img.resize(s.outWidth, s.outHeight, { fit: "fill", kernel: "lanczos3" });
  const cropLeft = Math.max(0, -s.outLeft);
  const cropTop = Math.max(0, -s.outTop);
  const placeLeft = Math.max(0, s.outLeft);
  const placeTop = Math.max(0, s.outTop);
  const visW = Math.max(1, Math.min(s.outWidth - cropLeft, W - placeLeft));
  const visH = Math.max(1, Math.min(s.outHeight - cropTop, H - placeTop));
  if (cropLeft || cropTop || visW !== s.outWidth || visH !== s.outHeight) img = img.extract({ left: cropLeft, top: cropTop, width: visW, height: visH });
  return img.extend({
    left: placeLeft,
    top: placeTop,
    right: Math.max(0, W - placeLeft - visW),
    bottom: Math.max(0, H - placeTop - visH) + footer,
    background: BACKGROUND,
  });
}

/** The kinds present among the shapes, in the palette's order, for the legend. */
function kindsShown(shapes: readonly AnyShape[]): MarkupKind[] {
  const present = new Set(shapes.map((s) => s.kind));
  return (Object.keys({ pad: 1, wire_bond: 1, block: 1, symmetry_axis: 1, trace: 1, ruler: 1, note: 1, die_outline: 1 }) as MarkupKind[]).filter((k) => present.has(k));
}

/** Height of one overlay band: libvips renders an SVG tile by tile, each tile drawing every element. */
const BAND_PX = 512;

/** The output rows [top, bottom] a shape may touch, with room for its stroke and label. */
function rowSpan(shape: AnyShape, m: Affine2x3, margin: number): [number, number] {
  const b = boundingBox(shape.geometry);
  const ys = [applyAffine(m, b.minX, b.minY)[1], applyAffine(m, b.maxX, b.maxY)[1]];
  return [Math.min(...ys) - margin, Math.max(...ys) + margin];
}

/**
 * The markup as horizontal bands of SVG, each holding only the shapes that reach into it, so
 * the cost of rasterising grows with the shapes per band rather than shapes × tiles.
 */
function markupBands(input: RenderInput): { input: Buffer; top: number; left: number; limitInputPixels: false }[] {
  const { plan } = input;
  const style = markupStyle(plan.width);
  const margin = style.fontPx * 2 + style.stroke * 4;
  const spans = input.shapes.map((s) => rowSpan(s, plan.dieToOutput, margin));
  const bands = [];
  for (let top = 0; top < plan.height; top += BAND_PX) {
    const height = Math.min(BAND_PX, plan.height - top);
    const shapes = input.shapes.filter((_, i) => spans[i][1] >= top && spans[i][0] <= top + height);
    if (shapes.length === 0 && input.threads.length === 0) continue;
    const [[a, b, tx], [c, d, ty]] = plan.dieToOutput;
    const m: Affine2x3 = [[a, b, tx], [c, d, ty - top]];
    const layer = markupLayerSvg(shapes, m, plan.width, { labels: input.labels, threads: input.threads });
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${plan.width}" height="${height}" font-family="DejaVu Sans, sans-serif">${layer}</svg>`;
    bands.push({ input: Buffer.from(svg), top, left: 0, limitInputPixels: false as const });
  }
  return bands;
}

/** The sharp pipeline of the whole export, and where its parts were drawn. */
export function annotatedPipeline(input: RenderInput): { pipeline: Sharp; info: RenderInfo } {
  const { plan } = input;
  const kinds = kindsShown(input.shapes);
  const footer = footerSvg(plan.width, 0, plan.umPerPx, input.title, kinds);
  const total = plan.height + footer.height;
  const footerImage = `<svg xmlns="http://www.w3.org/2000/svg" width="${plan.width}" height="${footer.height}" font-family="DejaVu Sans, sans-serif">${footer.svg}</svg>`;
  const out = imageLayer(input, footer.height)
    .toColourspace("srgb")
    .composite([...markupBands(input), { input: Buffer.from(footerImage), top: plan.height, left: 0, limitInputPixels: false }])
    .removeAlpha();
  const scaleBar = { ...footer.scaleBar, y: footer.scaleBar.y + plan.height };
  return { pipeline: out, info: { width: plan.width, height: total, imageHeight: plan.height, scaleBar, kinds } };
}

/** The PNG text chunks an export carries (title, scale, software). */
export function exportTextChunks(title: TitleBlock, umPerPx: number): Record<string, string> {
  return {
    Title: `${title.caseTitle} – ${title.dieName} – ${title.micrograph}`,
    Description: `Scale ${umPerPx} um/px (${formatScale(umPerPx).replace("µ", "u")}); die frame in um, origin lower-left, y up`,
    Software: "Kerfline",
    "Creation Time": title.date,
    Author: title.author,
  };
}

const PNG_OPTIONS = { compressionLevel: 6, adaptiveFiltering: false } as const;

/** Renders into a PNG buffer (small outputs: the report's overview). */
export async function renderAnnotatedPngBuffer(input: RenderInput): Promise<{ png: Buffer; info: RenderInfo }> {
  const { pipeline: p, info } = annotatedPipeline(input);
  const png = await p.png(PNG_OPTIONS).toBuffer();
  const chunks = Object.entries(exportTextChunks(input.title, input.plan.umPerPx)).map(([k, v]) => textChunk(k, v));
  const ihdrEnd = 8 + 12 + png.readUInt32BE(8);
  return { png: Buffer.concat([png.subarray(0, ihdrEnd), ...chunks, png.subarray(ihdrEnd)]), info };
}

/**
 * Renders into a file: sharp streams the PNG to `temp`, then the text chunks are spliced in
 * after IHDR while copying to `outFile` (never holding the whole PNG in memory).
 */
export async function renderAnnotatedPngFile(input: RenderInput, outFile: string, temp = `${outFile}.partial`): Promise<RenderInfo & { bytes: number }> {
  const { pipeline: p, info } = annotatedPipeline(input);
  try {
    await p.png(PNG_OPTIONS).toFile(temp);
    const handle = await open(temp, "r");
    const head = Buffer.alloc(33);
    await handle.read(head, 0, 33, 0);
    await handle.close();
    const ihdrEnd = 8 + 12 + head.readUInt32BE(8);
    const chunks = Object.entries(exportTextChunks(input.title, input.plan.umPerPx)).map(([k, v]) => textChunk(k, v));
    const out = createWriteStream(outFile);
    out.write(Buffer.concat([head.subarray(0, ihdrEnd), ...chunks]));
    await pipeline(createReadStream(temp, { start: ihdrEnd }), out);
    return { ...info, bytes: (await stat(outFile)).size };
  } finally {
    await rm(temp, { force: true });
  }
}
