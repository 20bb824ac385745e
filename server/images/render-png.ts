import { createReadStream, createWriteStream } from "node:fs";
import { open, rm, stat } from "node:fs/promises";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import sharp, { type OverlayOptions, type Sharp } from "sharp";
import { MARKUP_KINDS, type AnyShape, type MarkupKind } from "@/lib/markup/types";
import { BACKGROUND, baseLayer, blank, type Scratch } from "./base-layer";
import { footerSvg, formatScale, type PlacedScaleBar, type TitleBlock } from "@/lib/export/footer-svg";
import type { ThreadMark } from "@/lib/export/markup-svg";
import { EXPORT_FONT_FAMILY, markupTiles, type OverlayTile } from "@/lib/export/overlay-tiles";
import { textChunk } from "@/lib/export/png-text";
import type { RenderPlan } from "@/lib/export/render-plan";

/**
 * Renders an annotated PNG with sharp in two stages. Stage one resamples the source window
 * onto the output grid (base-layer.ts). Stage two draws bands of rows: each band's image rows
 * with its markup and footer tiles (overlay-tiles.ts) composited over them; the bands are then
 * stacked while the PNG streams out. Memory stays near two bands' tiles plus a few output
 * rows: the intermediate rasters live in files beside the output.
 */

export type RenderInput = {
  readonly original: string | null;
  readonly pixelCap: number;
  readonly plan: RenderPlan;
  readonly shapes: readonly AnyShape[];
  readonly threads: readonly ThreadMark[];
  readonly labels: boolean;
  readonly title: TitleBlock;
  /** Called with the fraction done (0–1) as the stages finish. */
  readonly onProgress?: (fraction: number) => void;
};

export type RenderInfo = {
  readonly width: number;
  readonly height: number;
  readonly imageHeight: number;
  readonly scaleBar: PlacedScaleBar;
  readonly kinds: readonly MarkupKind[];
};

/** The kinds present among the shapes, in MARKUP_KINDS order (the palette's), for the legend. */
function kindsShown(shapes: readonly AnyShape[]): MarkupKind[] {
  const present = new Set(shapes.map((s) => s.kind));
  return MARKUP_KINDS.filter((k) => present.has(k));
}

/** SVG rasterisations and bands run this many at a time (one per core). */
const CONCURRENCY = 2;

/** Rows of output drawn per band, and the height of the markup tiles. */
const BAND_ROWS = 512;

/** Runs `job` over `items`, `CONCURRENCY` at a time, keeping the results in order. */
async function inTurn<T, R>(items: readonly T[], job: (item: T, index: number) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array(items.length);
  let next = 0;
  const worker = async () => {
    while (next < items.length) {
      const i = next++;
      out[i] = await job(items[i], i);
    }
  };
  await Promise.all(Array.from({ length: Math.min(CONCURRENCY, items.length) }, worker));
  return out;
}

/** Rasterises one tile to raw RGBA, placed relative to its band's top row. */
async function rasterise(t: OverlayTile, bandTop: number): Promise<OverlayOptions> {
  const { data, info } = await sharp(Buffer.from(t.svg), { limitInputPixels: false }).raw().toBuffer({ resolveWithObject: true });
  return { input: data, raw: { width: info.width, height: info.height, channels: 4 }, left: t.left, top: t.top - bandTop };
}

/** The footer cut along the band grid: full-width tiles, each shifting the footer into place. */
function footerTiles(svg: string, width: number, top: number, height: number): OverlayTile[] {
  const tiles: OverlayTile[] = [];
  for (let y = top; y < top + height; y = (Math.floor(y / BAND_ROWS) + 1) * BAND_ROWS) {
    const h = Math.min((Math.floor(y / BAND_ROWS) + 1) * BAND_ROWS, top + height) - y;
    tiles.push({
      svg: `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${h}" font-family="${EXPORT_FONT_FAMILY}"><g transform="translate(0 ${-y})">${svg}</g></svg>`,
      left: 0,
      top: y,
      width,
      height: h,
    });
  }
  return tiles;
}

type Band = { readonly top: number; readonly height: number; readonly tiles: OverlayTile[] };

/** One band of the output: its rows of the image area (or footer background), markup drawn over. */
async function drawBand(base: Sharp, band: Band, width: number, imageHeight: number): Promise<Sharp> {
  const imageRows = Math.max(0, Math.min(band.height, imageHeight - band.top));
  let img: Sharp;
  if (imageRows === 0) img = blank(width, band.height);
  else {
    img = base.clone();
    if (band.top !== 0 || imageRows !== imageHeight) img = img.extract({ left: 0, top: band.top, width, height: imageRows });
    if (imageRows < band.height) img = img.extend({ bottom: band.height - imageRows, background: BACKGROUND });
  }
  const overlays = await inTurn(band.tiles, (t) => rasterise(t, band.top));
  return overlays.length ? img.composite(overlays).removeAlpha() : img;
}

/**
 * Builds the final pipeline. Small renders (scratch in memory) draw everything in one band;
 * file renders draw bands of BAND_ROWS rows, each written out, then stacked while the PNG is
 * encoded, so no stage holds more than a band's markup at once.
 */
async function annotated(input: RenderInput, scratch: Scratch): Promise<{ pipeline: Sharp; info: RenderInfo }> {
  const { plan } = input;
  const W = plan.width;
  const H = plan.height;
  const kinds = kindsShown(input.shapes);
  const footer = footerSvg(W, H, plan.umPerPx, input.title, kinds);
  const total = H + footer.height;
  const info: RenderInfo = { width: W, height: total, imageHeight: H, scaleBar: footer.scaleBar, kinds };
  const base = await baseLayer(input.original, input.pixelCap, plan, scratch);
  input.onProgress?.(0.4);
  const rows = scratch.dir ? BAND_ROWS : Math.ceil(total / BAND_ROWS) * BAND_ROWS;
  const tiles = [
    ...markupTiles(input.shapes, input.threads, plan.dieToOutput, W, H, { labels: input.labels, tileHeight: BAND_ROWS }),
    ...footerTiles(footer.svg, W, H, footer.height),
  ];
  const bands: Band[] = [];
  for (let top = 0; top < total; top += rows)
    bands.push({ top, height: Math.min(rows, total - top), tiles: tiles.filter((t) => t.top >= top && t.top < top + rows) });
  if (bands.length === 1) {
    const only = await drawBand(base, bands[0], W, H);
    input.onProgress?.(0.8);
    return { pipeline: only, info };
  }
  let done = 0;
  const files = await inTurn(bands, async (band, i) => {
    const file = path.join(scratch.dir!, `${scratch.stem}-band${i}.png`);
    scratch.files.push(file);
    // PNG, lightly compressed: read back sequentially with a small buffer, where a strip TIFF
    // would be held whole by the join below.
    await (await drawBand(base, band, W, H)).png({ compressionLevel: 1 }).toFile(file);
    input.onProgress?.(0.4 + (0.45 * ++done) / bands.length);
    return file;
  });
  // Stacked one per row; every cell is as tall as the tallest band, so the short last one is cropped back.
  const stacked = sharp(files, { join: { across: 1, valign: "top" }, limitInputPixels: false, sequentialRead: true }).extract({
    left: 0,
    top: 0,
    width: W,
    height: total,
  });
  return { pipeline: stacked, info };
}

async function cleanUp(scratch: Scratch) {
  await Promise.all(scratch.files.map((f) => rm(f, { force: true })));
}

/** The PNG text chunks an export carries (title, scale, software). */
function exportTextChunks(title: TitleBlock, umPerPx: number): Record<string, string> {
  return {
    Title: `${title.caseTitle} – ${title.dieName} – ${title.micrograph}`,
    Description: `Scale ${umPerPx} um/px (${formatScale(umPerPx).replace("µ", "u")}); die frame in um, origin lower-left, y up`,
    Software: "Kerfline",
    "Creation Time": title.date,
    Author: title.author,
    Revision: title.revision,
  };
}

const PNG_OPTIONS = { compressionLevel: 6, adaptiveFiltering: false } as const;

/** Renders into a PNG buffer, intermediates in memory (small outputs: the report's overview). */
export async function renderAnnotatedPngBuffer(input: RenderInput): Promise<{ png: Buffer; info: RenderInfo }> {
  const { pipeline: p, info } = await annotated(input, { dir: null, stem: "", files: [] });
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
  const scratch: Scratch = { dir: path.dirname(outFile), stem: `${path.basename(outFile)}.partial`, files: [] };
  try {
    const { pipeline: p, info } = await annotated(input, scratch);
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
  } catch (e) {
    await rm(outFile, { force: true });
    throw e;
  } finally {
    await rm(temp, { force: true });
    await cleanUp(scratch);
  }
}
