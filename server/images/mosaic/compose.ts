import "server-only";
import { open, rename, rm, type FileHandle } from "node:fs/promises";
import { blendWeights } from "@/lib/mosaic/seams";
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
  gain: Float32Array | null;
  outPath: string;
  onProgress?: (percent: number) => void;
};

/**
 * Writes the mosaic as an uncompressed strip BigTIFF, one band of STRIP_ROWS output rows at a
 * time: each band gathers the rows of the frames that cross it from their raw files, weighs
 * them by the seam blend (and the shading gain) and divides by the summed weight. Memory is
 * one band of the mosaic plus one band of a frame, whatever the mosaic's height; the file is
 * written under a temporary name and renamed when complete.
 */
export async function composeMosaic(input: ComposeInput): Promise<void> {
  const { frames, frameWidth: fw, frameHeight: fh, channels: ch, width, height, gain } = input;
  const weights = blendWeights(frames, fw, fh);
  const partial = `${input.outPath}.partial`;
  const out = await open(partial, "w");
  const handles = new Map<number, FileHandle>();
  try {
    await out.write(bigTiffHeader({ width, height, channels: ch, rowsPerStrip: STRIP_ROWS }));
    const acc = new Float32Array(STRIP_ROWS * width * ch);
    const wsum = new Float32Array(STRIP_ROWS * width);
    const rowsBuf = Buffer.alloc(STRIP_ROWS * fw * ch);
    const outBufs = [Buffer.alloc(STRIP_ROWS * width * ch), Buffer.alloc(STRIP_ROWS * width * ch)];
    let pendingWrite: Promise<unknown> = Promise.resolve();
    const bands = Math.ceil(height / STRIP_ROWS);
    for (let band = 0; band < bands; band++) {
      const y0 = band * STRIP_ROWS;
      const rows = Math.min(STRIP_ROWS, height - y0);
      acc.fill(0, 0, rows * width * ch);
      wsum.fill(0, 0, rows * width);
      for (const f of frames) {
        const top = Math.max(y0, f.y);
        const bottom = Math.min(y0 + rows, f.y + fh);
        if (top >= bottom) continue;
        let handle = handles.get(f.index);
        if (!handle) {
          handle = await open(input.rawPaths[f.index], "r");
          handles.set(f.index, handle);
        }
        const n = (bottom - top) * fw * ch;
        await handle.read(rowsBuf, 0, n, (top - f.y) * fw * ch);
        accumulate(acc, wsum, rowsBuf, weights[f.index], gain, { fx: f.x, fy: f.y, top, bottom, y0, fw, ch, width });
        if (bottom === f.y + fh) {
          await handle.close();
          handles.delete(f.index);
        }
      }
      const outBuf = outBufs[band % 2];
      await pendingWrite;
      normalise(acc, wsum, outBuf, rows * width, ch);
      pendingWrite = out.write(outBuf, 0, rows * width * ch);
      input.onProgress?.(Math.floor((100 * (band + 1)) / bands));
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

type Span = { fx: number; fy: number; top: number; bottom: number; y0: number; fw: number; ch: number; width: number };

function accumulate(
  acc: Float32Array,
  wsum: Float32Array,
  src: Buffer,
  w: { wx: Float32Array; wy: Float32Array },
  gain: Float32Array | null,
  { fx, fy, top, bottom, y0, fw, ch, width }: Span,
): void {
  const { wx, wy } = w;
  for (let y = top; y < bottom; y++) {
    const wyv = wy[y - fy];
    const s0 = (y - top) * fw * ch;
    const g0 = (y - fy) * fw * ch;
    const p0 = (y - y0) * width + fx;
    if (ch === 3) {
      for (let x = 0, s = s0, g = g0, o = p0 * 3; x < fw; x++, s += 3, g += 3, o += 3) {
        const k = wx[x] * wyv;
        wsum[p0 + x] += k;
        if (gain) {
          acc[o] += k * gain[g] * src[s];
          acc[o + 1] += k * gain[g + 1] * src[s + 1];
          acc[o + 2] += k * gain[g + 2] * src[s + 2];
        } else {
          acc[o] += k * src[s];
          acc[o + 1] += k * src[s + 1];
          acc[o + 2] += k * src[s + 2];
        }
      }
    } else {
      for (let x = 0; x < fw; x++) {
        const k = wx[x] * wyv;
        wsum[p0 + x] += k;
        acc[p0 + x] += k * (gain ? gain[g0 + x] : 1) * src[s0 + x];
      }
    }
  }
}

function normalise(acc: Float32Array, wsum: Float32Array, out: Buffer, pixels: number, ch: number): void {
  const clamped = new Uint8ClampedArray(out.buffer, out.byteOffset, pixels * ch);
  for (let p = 0, o = 0; p < pixels; p++, o += ch) {
    const s = wsum[p];
    const inv = s > 0 ? 1 / s : 0;
    for (let c = 0; c < ch; c++) clamped[o + c] = acc[o + c] * inv;
  }
}
