// Ground truth for mosaic tests: a textured, die-like source image cut into a grid of
// overlapping frames at offsets the test chooses, so the recovered positions can be checked
// against the cut (not against the stitcher's own output).
import sharp, { type Sharp } from "sharp";

export type CutFrame = { index: number; row: number; col: number; x: number; y: number; bytes: Buffer; name: string };

/** A deterministic pseudo-random generator (mulberry32), so a failing case can be re-run. */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Grey metal-like rectangles (bond pads, bus lines, blocks) on a noisy background. */
async function dieLikeImage(width: number, height: number, seed: number): Promise<Sharp> {
  const rnd = random(seed);
  const px = Buffer.alloc(width * height * 3);
  for (let i = 0; i < width * height; i++) {
    const v = 60 + Math.floor(rnd() * 30);
    px[i * 3] = v;
    px[i * 3 + 1] = v + 10;
    px[i * 3 + 2] = v - 5;
  }
  const rects: string[] = [];
  for (let k = 0; k < (width * height) / 2500; k++) {
    const w = 8 + Math.floor(rnd() * 60);
    const h = 8 + Math.floor(rnd() * 60);
    const shade = 120 + Math.floor(rnd() * 120);
    rects.push(
      `<rect x="${Math.floor(rnd() * width)}" y="${Math.floor(rnd() * height)}" width="${w}" height="${h}" fill="rgb(${shade},${shade - 10},${shade - 40})"/>`,
    );
  }
  const svg = Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">${rects.join("")}</svg>`);
  const base = await sharp(px, { raw: { width, height, channels: 3 } })
    .composite([{ input: svg }])
    .png()
    .toBuffer();
  return sharp(base);
}

/**
 * Cuts a rows × cols grid of `frameWidth × frameHeight` JPEG frames from a synthetic image, in
 * capture order (`serpentine`: odd rows right to left), each at its nominal step for `overlap`
 * (fraction of a frame) plus an integer jitter of up to `jitter` px. Frame names are natural-
 * sorted file names (IMG_0001.jpg …).
 */
export async function cutMosaic(opts: {
  rows: number;
  cols: number;
  frameWidth: number;
  frameHeight: number;
  overlap: number;
  jitter?: number;
  order?: "rows" | "serpentine";
  seed?: number;
  /** A featureless (flat grey) area of the source image, to make a pair's overlap blank. */
  blank?: { x: number; y: number; width: number; height: number };
}): Promise<CutFrame[]> {
  const { rows, cols, frameWidth: fw, frameHeight: fh, overlap } = opts;
  const rnd = random((opts.seed ?? 7) + 1);
  const j = opts.jitter ?? 0;
  const stepX = Math.round(fw * (1 - overlap));
  const stepY = Math.round(fh * (1 - overlap));
  const width = stepX * (cols - 1) + fw + 2 * j;
  const height = stepY * (rows - 1) + fh + 2 * j;
  const source = await (await dieLikeImage(width, height, opts.seed ?? 7)).raw().toBuffer();
  if (opts.blank) {
    const b = opts.blank;
    for (let y = Math.max(0, b.y); y < Math.min(height, b.y + b.height); y++)
      source.fill(110, (y * width + Math.max(0, b.x)) * 3, (y * width + Math.min(width, b.x + b.width)) * 3);
  }
  const frames: CutFrame[] = [];
  for (let row = 0; row < rows; row++) {
    for (let step = 0; step < cols; step++) {
      const col = opts.order === "serpentine" && row % 2 === 1 ? cols - 1 - step : step;
      const x = col * stepX + j + Math.round((rnd() * 2 - 1) * j);
      const y = row * stepY + j + Math.round((rnd() * 2 - 1) * j);
      const bytes = await sharp(source, { raw: { width, height, channels: 3 } })
        .extract({ left: x, top: y, width: fw, height: fh })
        .jpeg({ quality: 92 })
        .toBuffer();
      const index = frames.length;
      frames.push({ index, row, col, x, y, bytes, name: `IMG_${String(index + 1).padStart(4, "0")}.jpg` });
    }
  }
  return frames;
}

/** The multipart body of a mosaic upload: fields first, then the frames in capture order. */
export function mosaicForm(fields: Record<string, string>, frames: { bytes: Buffer; name: string }[]): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  for (const f of frames) form.append("file", new Blob([new Uint8Array(f.bytes)]), f.name);
  return form;
}
