import "server-only";
import { Matrix, solve } from "ml-matrix";
import { sharpInput } from "../limits";
import type { GreyPatch } from "@/lib/mosaic/patch";

/**
 * Reading mosaic frames with sharp: every frame is decoded once to 8-bit chunky pixels (grey
 * or RGB, alpha dropped), and for shading correction the frames are also read as tiny
 * thumbnails.
 */

export type FrameChannels = 1 | 3;

/** Grey frames stay grey; any colour frame makes the whole mosaic RGB. */
export async function mosaicChannels(framePaths: string[]): Promise<FrameChannels> {
  for (const p of framePaths) {
    const meta = await sharpInput(p).metadata();
    if ((meta.channels ?? 3) >= 3 && meta.space !== "b-w" && meta.space !== "grey16") return 3;
  }
  return 1;
}

function pipeline(path: string, channels: FrameChannels) {
  return sharpInput(path)
    .removeAlpha()
    .toColourspace(channels === 3 ? "srgb" : "b-w");
}

/** The frame's pixels, row-major, `channels` bytes per pixel. */
export async function decodeFrame(path: string, channels: FrameChannels, width: number, height: number): Promise<Buffer> {
  const { data, info } = await pipeline(path, channels).raw({ depth: "uchar" }).toBuffer({ resolveWithObject: true });
  if (info.width !== width || info.height !== height || info.channels !== channels) {
    throw new Error(`frame ${path} decoded to ${info.width}×${info.height}×${info.channels}, expected ${width}×${height}×${channels}`);
  }
  return data;
}

/** Fraction bits of a fixed-point gain (gains up to 4 fit a Uint16Array). */
export const GAIN_SHIFT = 14;
const GAIN_ONE = 1 << GAIN_SHIFT;

/** Side of the thumbnails the shading is estimated on. */
const SHADING_GRID = 32;
/** At most this many frames, evenly spread over the capture, enter the median. */
const SHADING_FRAMES = 64;

/**
 * Shading (flat-field) correction estimated from the frames themselves: the per-pixel median
 * of small thumbnails of the frames (what stays the same while the scene changes is the
 * illumination and optics), smoothed by a least-squares quadratic surface per channel so that
 * what is left of the scene in the median cannot print into the mosaic. Returns the gain
 * per pixel and channel (mean / shading), row-major like the frame, in fixed point
 * (GAIN_ONE = 1) so that applying it is integer arithmetic.
 */
export async function shadingGain(framePaths: string[], channels: FrameChannels, width: number, height: number): Promise<Uint16Array> {
  const step = Math.max(1, framePaths.length / SHADING_FRAMES);
  const picked: string[] = [];
  for (let k = 0; k < framePaths.length && picked.length < SHADING_FRAMES; k += step) picked.push(framePaths[Math.floor(k)]);
  const g = SHADING_GRID;
  const thumbs = await Promise.all(picked.map((p) => pipeline(p, channels).resize(g, g, { fit: "fill", kernel: "linear" }).raw({ depth: "uchar" }).toBuffer()));
  // Shared memory: the shading worker (gain-worker.ts) reads it too.
  const gain = new Uint16Array(new SharedArrayBuffer(width * height * channels * 2));
  const values = new Float64Array(thumbs.length);
  for (let c = 0; c < channels; c++) {
    const median = new Float64Array(g * g);
    for (let i = 0; i < g * g; i++) {
      thumbs.forEach((t, k) => (values[k] = t[i * channels + c]));
      const s = Array.from(values).sort((p, q) => p - q);
      median[i] = s.length % 2 ? s[s.length >> 1] : (s[(s.length >> 1) - 1] + s[s.length >> 1]) / 2;
    }
    const surface = quadraticSurface(median, g);
    let mean = 0;
    for (let j = 0; j < g; j++) for (let i = 0; i < g; i++) mean += surface((i + 0.5) / g, (j + 0.5) / g);
    mean /= g * g;
    const [a, b, cy, d, e, f] = surface.coef;
    for (let y = 0; y < height; y++) {
      const v = (y + 0.5) / height - 0.5;
      for (let x = 0; x < width; x++) {
        const u = (x + 0.5) / width - 0.5;
        const shade = a + b * u + cy * v + d * u * u + e * u * v + f * v * v;
        gain[(y * width + x) * channels + c] = Math.min(65535, Math.round((GAIN_ONE * mean) / Math.max(1, shade)));
      }
    }
  }
  return gain;
}

/** Least-squares fit of a + bx + cy + dx² + exy + fy² to a g × g grid on the unit square. */
function quadraticSurface(grid: Float64Array, g: number): ((x: number, y: number) => number) & { coef: number[] } {
  const terms = (x: number, y: number) => [1, x, y, x * x, x * y, y * y];
  const rows: number[][] = [];
  const rhs: number[][] = [];
  for (let j = 0; j < g; j++) {
    for (let i = 0; i < g; i++) {
      rows.push(terms((i + 0.5) / g - 0.5, (j + 0.5) / g - 0.5));
      rhs.push([grid[j * g + i]]);
    }
  }
  const coef = solve(new Matrix(rows), new Matrix(rhs)).getColumn(0);
  return Object.assign((x: number, y: number) => terms(x - 0.5, y - 0.5).reduce((s, t, k) => s + t * coef[k], 0), { coef });
}

/**
 * A grey copy of one rectangle of a frame for registration: the frame itself when grey, the
 * green channel of a colour frame (the channel a colour sensor samples most densely; one read
 * per pixel instead of three), times the shading gain when there is one.
 */
export function greyRect(
  pixels: Uint8Array,
  width: number,
  channels: FrameChannels,
  gain: Uint16Array | null,
  x0: number,
  y0: number,
  w: number,
  h: number,
): GreyPatch {
  const data = new Float32Array(w * h);
  const unit = 1 / GAIN_ONE;
  const offset = channels === 1 ? 0 : 1;
  for (let y = 0; y < h; y++) {
    const i0 = ((y0 + y) * width + x0) * channels + offset;
    const d0 = y * w;
    if (gain) for (let x = 0, i = i0; x < w; x++, i += channels) data[d0 + x] = pixels[i] * gain[i] * unit;
    else for (let x = 0, i = i0; x < w; x++, i += channels) data[d0 + x] = pixels[i];
  }
  return { data, x0, y0, width: w, height: h };
}
