import "server-only";
import { mkdir, rm, writeFile } from "node:fs/promises";
import path from "node:path";
import { captureGrid, type CaptureOrder, type GridCell } from "@/lib/mosaic/grid";
import type { GreyPatch } from "@/lib/mosaic/patch";
import { applyStageModel, placeFrames, type MeasuredPair } from "@/lib/mosaic/placement";
import { registerPair } from "@/lib/mosaic/register-pair";
import type { MosaicLayout, StitchStage } from "@/lib/mosaic/types";
import { composeMosaic } from "./compose";
import { startGainWorker, type GainWorker } from "./gain-worker";
import { GAIN_SHIFT, decodeFrame, greyRect, mosaicChannels, shadingGain, type FrameChannels } from "./frames";
import { probeImage } from "../limits";

export type StitchInput = {
  /** Local files, in capture order, all of the same size (the caller has checked them). */
  framePaths: string[];
  rows: number;
  cols: number;
  order: CaptureOrder;
  /** Nominal overlap of neighbouring frames, percent of the frame (5–60). */
  overlapPercent: number;
  /** Shading correction from the frames' median. */
  flatField: boolean;
  /** Where the mosaic is written: an uncompressed strip BigTIFF (8-bit grey or RGB). */
  outPath: string;
  /** Scratch folder; the stitcher removes what it wrote there. */
  workDir: string;
  onProgress?: (stage: StitchStage, percent: number) => void;
};

/** How far from the nominal overlap a neighbour is looked for, as a share of the frame. */
const SEARCH_SHARE = 0.08;

type Strips = { right?: GreyPatch; bottom?: GreyPatch };

/**
 * Stitches a grid of overlapping frames into one image: registers every neighbour pair
 * (lib/mosaic/register-pair.ts), replaces weak pairs by the stage model and places the frames
 * by weighted least squares (lib/mosaic/placement.ts), then composes the mosaic band by band
 * (compose.ts) into `outPath`, an uncompressed strip BigTIFF that buildPyramid tiles like any
 * upload. Each frame is decoded once (plus a thumbnail when shading is corrected) and
 * corrected for shading; its raw pixels wait in `workDir` for composition, and registration keeps only edge strips of the
 * previous grid row. Frame 0 is at the origin of the fit; the mosaic's origin is then moved
 * to the top-left of the frames' bounding box.
 */
export async function stitchMosaic(input: StitchInput): Promise<MosaicLayout> {
  const { framePaths, rows, cols, order, workDir } = input;
  if (framePaths.length !== rows * cols) throw new RangeError(`expected ${rows * cols} frames, got ${framePaths.length}`);
  if (!(input.overlapPercent >= 5 && input.overlapPercent <= 60)) throw new RangeError("overlapPercent must be within 5–60");
  const report = (stage: StitchStage, percent: number) => {
    try {
      input.onProgress?.(stage, percent);
    } catch {
      // A failing progress listener must not abort the stitching.
    }
  };
  report("registering", 0);
  const { width: fw, height: fh } = await probeImage(framePaths[0]);
  const channels = await mosaicChannels(framePaths);
  const gain = input.flatField ? await shadingGain(framePaths, channels, fw, fh) : null;
  const cells = captureGrid(rows, cols, order);
  const own = path.join(workDir, "mosaic-frames");
  await mkdir(own, { recursive: true });
  try {
    const rawPaths = framePaths.map((_, i) => path.join(own, `frame-${i}.raw`));
    const measured = await registerAll({ ...input, cells, fw, fh, channels, gain, rawPaths }, (p) => report("registering", p));
    report("placing", 0);
    const { pairs, warnings } = applyStageModel(measured);
    const fit = placeFrames(framePaths.length, pairs);
    const minX = Math.min(...fit.positions.map((p) => Math.round(p.x)));
    const minY = Math.min(...fit.positions.map((p) => Math.round(p.y)));
    const frames = cells.map((c) => ({ ...c, x: Math.round(fit.positions[c.index].x) - minX, y: Math.round(fit.positions[c.index].y) - minY }));
    const width = Math.max(...frames.map((f) => f.x)) + fw;
    const height = Math.max(...frames.map((f) => f.y)) + fh;
    report("placing", 100);
    report("composing", 0);
    await composeMosaic({
      frames,
      rawPaths,
      frameWidth: fw,
      frameHeight: fh,
      channels,
      width,
      height,
      outPath: input.outPath,
      onProgress: (p) => report("composing", p),
    });
    const residualPx = { rms: Math.round(fit.residualPx.rms * 1000) / 1000, max: Math.round(fit.residualPx.max * 1000) / 1000 };
    return { rows, cols, order, frameWidth: fw, frameHeight: fh, width, height, frames, pairs, residualPx, warnings };
  } finally {
    await rm(own, { recursive: true, force: true });
  }
}

type RegisterContext = StitchInput & {
  cells: GridCell[];
  fw: number;
  fh: number;
  channels: FrameChannels;
  gain: Uint16Array | null;
  rawPaths: string[];
};

/**
 * Decodes the frames in grid order (row by row, whatever the capture order), saves their raw
 * pixels for composition and measures each frame against its left and upper neighbours.
 */
async function registerAll(ctx: RegisterContext, progress: (percent: number) => void): Promise<MeasuredPair[]> {
  const { rows, cols, fw, fh, channels, gain, framePaths } = ctx;
  const byCell = new Map(ctx.cells.map((c) => [c.row * cols + c.col, c.index]));
  const gridOrder = Array.from({ length: rows * cols }, (_, k) => byCell.get(k)!);
  const overlap = ctx.overlapPercent / 100;
  const nominalX = Math.round(fw * (1 - overlap));
  const nominalY = Math.round(fh * (1 - overlap));
  const search = { x: Math.ceil(SEARCH_SHARE * fw), y: Math.ceil(SEARCH_SHARE * fh) };
  const factor = Math.max(1, Math.floor(Math.max(fw, fh) / 512));
  const stripW = Math.min(fw, fw - nominalX + search.x);
  const stripH = Math.min(fh, fh - nominalY + search.y);
  const kept = new Map<number, Strips>();
  const measured: MeasuredPair[] = [];
  const frameBytes = fw * fh * channels;
  // Frames in flight share a few buffers in shared memory (the shading worker writes them).
  const pool = Array.from({ length: 3 }, () => new SharedArrayBuffer(frameBytes));
  const released: Promise<void>[] = [];
  const worker: GainWorker | null = gain ? startGainWorker(gain.buffer as SharedArrayBuffer, GAIN_SHIFT) : null;
  // Two frames decode ahead while the current one is measured.
  const decode = (k: number) => {
    const p = k < gridOrder.length ? decodeFrame(framePaths[gridOrder[k]], channels, fw, fh) : Promise.resolve(null);
    p.catch(() => {}); // awaited in its turn; this only keeps an early failure from going unhandled
    return p;
  };
  const ahead = [decode(0), decode(1)];
  try {
    for (let k = 0; k < gridOrder.length; k++) {
      const decoded = (await ahead.shift())!;
      ahead.push(decode(k + 2));
      if (released.length >= pool.length) await released[released.length - pool.length];
      const shared = pool[k % pool.length];
      const pixels = new Uint8Array(shared, 0, frameBytes);
      pixels.set(decoded);
      const index = gridOrder[k];
      const row = Math.floor(k / cols);
      const col = k % cols;
      const strip = (x0: number, y0: number, w: number, h: number) => greyRect(pixels, fw, channels, gain, x0, y0, w, h);
      const mineLeft = col > 0 ? strip(0, 0, stripW, fh) : null;
      const mineTop = row > 0 ? strip(0, 0, fw, stripH) : null;
      const strips: Strips = {};
      if (col < cols - 1) strips.right = strip(fw - stripW, 0, stripW, fh);
      if (row < rows - 1) strips.bottom = strip(0, fh - stripH, fw, stripH);
      kept.set(k, strips);
      // The strips are taken; the whole frame is corrected and saved beside the measuring.
      const corrected = worker ? worker.apply(shared, frameBytes) : Promise.resolve();
      const saved = corrected.then(() => writeFile(ctx.rawPaths[index], pixels));
      saved.catch(() => {}); // awaited below; this only keeps an early failure from going unhandled
      released.push(saved);
      if (mineLeft) {
        const left = kept.get(k - 1)!;
        const m = registerPair(left.right!, mineLeft, { nominal: { dx: nominalX, dy: 0 }, search }, factor);
        measured.push({ a: gridOrder[k - 1], b: index, direction: "horizontal", nominal: { dx: nominalX, dy: 0 }, ...m });
        delete left.right;
      }
      if (mineTop) {
        const m = registerPair(kept.get(k - cols)!.bottom!, mineTop, { nominal: { dx: 0, dy: nominalY }, search }, factor);
        measured.push({ a: gridOrder[k - cols], b: index, direction: "vertical", nominal: { dx: 0, dy: nominalY }, ...m });
        kept.delete(k - cols);
      }
      progress(Math.floor((100 * (k + 1)) / gridOrder.length));
    }
    await Promise.all(released);
  } finally {
    await Promise.allSettled(released);
    await worker?.close();
  }
  return measured;
}
