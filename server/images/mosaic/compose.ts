import "server-only";
import { open, rename, rm, type FileHandle } from "node:fs/promises";
import { blendWeights, type BlendWeights } from "@/lib/mosaic/seams";
import type { MosaicFrame } from "@/lib/mosaic/types";
import { bigTiffHeader } from "./bigtiff";
import type { FrameChannels } from "./frames";

/** Output rows composed at a time: the only part of the mosaic ever held in memory. */
const STRIP_ROWS = 128;

export type ComposeInput = {
  frames: MosaicFrame[];
  /** Raw pixels of each frame (row-major, `channels` bytes per pixel), by frame index. */
  rawPaths: string[];
  frameWidth: number;
  frameHeight: number;
  channels: FrameChannels;
  width: number;
  height: number;
  outPath: string;
  onProgress?: (percent: number) => void;
};

/** One band of the output and the work arrays for it. */
type Band = {
  y0: number;
  rows: number;
  width: number;
  ch: number;
  out: Buffer;
  /** Pixels already final: inside some frame's core. */
  done: Uint8Array;
  acc: Float32Array;
  wsum: Float32Array;
};

/** Rows [top, bottom) of one frame, read from its raw file into `src`. */
type FrameRows = { f: MosaicFrame; w: BlendWeights; src: Buffer; top: number; bottom: number; fw: number };

/**
 * Writes the mosaic as an uncompressed strip BigTIFF, one band of STRIP_ROWS output rows at a
 * time. In a band, every frame's core (where its blend weight is 1) is copied straight out;
 * the rest, the seams' cross-fades, is the weighted mean of the
 * frames there. Memory is one band of the mosaic plus one band of a frame, whatever the
 * mosaic's size; the file is written under a temporary name and renamed when complete.
 */
export async function composeMosaic(input: ComposeInput): Promise<void> {
  const { frames, frameWidth: fw, frameHeight: fh, channels: ch, width, height } = input;
  const weights = blendWeights(frames, fw, fh);
  const partial = `${input.outPath}.partial`;
  const out = await open(partial, "w");
  const handles = new Map<number, FileHandle>();
  try {
    await out.write(bigTiffHeader({ width, height, channels: ch, rowsPerStrip: STRIP_ROWS }));
    const outBufs = [Buffer.alloc(STRIP_ROWS * width * ch), Buffer.alloc(STRIP_ROWS * width * ch)];
    const work = { done: new Uint8Array(STRIP_ROWS * width), acc: new Float32Array(STRIP_ROWS * width * ch), wsum: new Float32Array(STRIP_ROWS * width) };
    const srcBufs = new Map<number, Buffer>();
    let pendingWrite: Promise<unknown> = Promise.resolve();
    const bands = Math.ceil(height / STRIP_ROWS);
    for (let k = 0; k < bands; k++) {
      const y0 = k * STRIP_ROWS;
      const rows = Math.min(STRIP_ROWS, height - y0);
      await pendingWrite;
      const band: Band = { y0, rows, width, ch, out: outBufs[k % 2], ...work };
      band.out.fill(0, 0, rows * width * ch);
      band.done.fill(0, 0, rows * width);
      band.acc.fill(0, 0, rows * width * ch);
      band.wsum.fill(0, 0, rows * width);
      const crossing: FrameRows[] = [];
      for (const f of frames) {
        const top = Math.max(y0, f.y);
        const bottom = Math.min(y0 + rows, f.y + fh);
        if (top >= bottom) continue;
        let handle = handles.get(f.index);
        if (!handle) {
          handle = await open(input.rawPaths[f.index], "r");
          handles.set(f.index, handle);
        }
        let src = srcBufs.get(f.index);
        if (!src) {
          src = Buffer.alloc(STRIP_ROWS * fw * ch);
          srcBufs.set(f.index, src);
        }
        await handle.read(src, 0, (bottom - top) * fw * ch, (top - f.y) * fw * ch);
        crossing.push({ f, w: weights[f.index], src, top, bottom, fw });
        if (bottom === f.y + fh) {
          await handle.close();
          handles.delete(f.index);
          srcBufs.delete(f.index);
        }
      }
      for (const fr of crossing) copyCore(band, fr);
      for (const fr of crossing) accumulateSeams(band, fr);
      resolveSeams(band);
      pendingWrite = out.write(band.out, 0, rows * width * ch);
      input.onProgress?.(Math.floor((100 * (k + 1)) / bands));
    }
    await pendingWrite;
    await out.close();
    await rename(partial, input.outPath);
  } catch (err) {
    await out.close().catch(() => {});
    await rm(partial, { force: true });
    throw err;
  } finally {
    for (const h of handles.values()) await h.close().catch(() => {});
  }
}

/** Copies the frame's core rows in this band to the output. */
function copyCore(band: Band, { f, w, src, top, bottom, fw }: FrameRows): void {
  const { ch, width, y0 } = band;
  const from = Math.max(top, f.y + w.coreY0);
  const to = Math.min(bottom, f.y + w.coreY1);
  const n = (w.coreX1 - w.coreX0) * ch;
  if (n <= 0) return;
  for (let y = from; y < to; y++) {
    const s0 = ((y - top) * fw + w.coreX0) * ch;
    const o0 = ((y - y0) * width + f.x + w.coreX0) * ch;
    src.copy(band.out, o0, s0, s0 + n);
    const p0 = (y - y0) * width + f.x + w.coreX0;
    band.done.fill(1, p0, p0 + (w.coreX1 - w.coreX0));
  }
}

/** Adds the frame's weighted pixels wherever no core has settled the output. */
function accumulateSeams(band: Band, { f, w, src, top, bottom, fw }: FrameRows): void {
  const { ch, width, y0, done, acc, wsum } = band;
  const { wx, wy } = w;
  for (let y = top; y < bottom; y++) {
    const fy = y - f.y;
    const wyv = wy[fy];
    const inCore = fy >= w.coreY0 && fy < w.coreY1;
    const s0 = (y - top) * fw * ch;
    const p0 = (y - y0) * width + f.x;
    for (let x = 0; x < fw; x++) {
      if (inCore && x === w.coreX0) x = Math.max(x, w.coreX1);
      if (x >= fw) break;
      const p = p0 + x;
      if (done[p]) continue;
      const k = wx[x] * wyv;
      wsum[p] += k;
      const s = s0 + x * ch;
      const o = p * ch;
      for (let c = 0; c < ch; c++) acc[o + c] += k * src[s + c];
    }
  }
}

/** Turns the accumulated seams into output pixels; pixels no frame covers stay black. */
function resolveSeams(band: Band): void {
  const { rows, width, ch, done, acc, wsum } = band;
  const clamped = new Uint8ClampedArray(band.out.buffer, band.out.byteOffset, band.out.length);
  const pixels = rows * width;
  for (let p = 0; p < pixels; p++) {
    if (done[p]) continue;
    const s = wsum[p];
    if (s <= 0) continue;
    const inv = 1 / s;
    const o = p * ch;
    for (let c = 0; c < ch; c++) clamped[o + c] = acc[o + c] * inv;
  }
}
