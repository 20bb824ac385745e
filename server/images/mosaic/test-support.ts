import path from "node:path";
import sharp from "sharp";
import { seededGaussian, seededRandom } from "@/lib/alignment/test-support";
import { captureGrid, type CaptureOrder } from "@/lib/mosaic/grid";

/**
 * Ground truth for the stitching tests and the benchmark, made here rather than measured: a
 * die-like RGB scene (blocks, bond pads, traces, vias and fine texture) and frames cut from it
 * at known, jittered positions, each with its own brightness, the same vignetting and its own
 * sensor noise. Test and benchmark use only.
 */

export type Scene = { rgb: Buffer; width: number; height: number };

/** A textured die-like scene, `width` × `height` RGB, repeatable from the seed. */
export async function dieLikeScene(width: number, height: number, seed: number, blank?: Rect): Promise<Scene> {
  const rnd = seededRandom(seed);
  const pick = <T>(xs: T[]) => xs[Math.floor(rnd() * xs.length)];
  const parts: string[] = [`<rect width="${width}" height="${height}" fill="rgb(70,82,76)"/>`];
  const area = width * height;
  for (let i = 0; i < area / 9000; i++) {
    const w = 20 + rnd() * 160;
    const h = 20 + rnd() * 120;
    const fill = pick(["rgb(120,128,110)", "rgb(150,140,100)", "rgb(95,105,120)", "rgb(60,64,60)", "rgb(170,160,140)"]);
    parts.push(`<rect x="${(rnd() * width).toFixed(1)}" y="${(rnd() * height).toFixed(1)}" width="${w.toFixed(1)}" height="${h.toFixed(1)}" fill="${fill}"/>`);
  }
  for (let i = 0; i < area / 6000; i++) {
    const x = rnd() * width;
    const y = rnd() * height;
    const len = 30 + rnd() * 250;
    const [x2, y2] = rnd() < 0.5 ? [x + len, y] : [x, y + len];
    parts.push(
      `<line x1="${x.toFixed(1)}" y1="${y.toFixed(1)}" x2="${x2.toFixed(1)}" y2="${y2.toFixed(1)}" stroke="rgb(200,180,120)" stroke-width="${(1.5 + rnd() * 4).toFixed(1)}"/>`,
    );
  }
  for (let i = 0; i < area / 20000; i++) {
    const s = 14 + rnd() * 30;
    const x = rnd() * width;
    const y = rnd() * height;
    parts.push(
      `<rect x="${x.toFixed(1)}" y="${y.toFixed(1)}" width="${s.toFixed(1)}" height="${s.toFixed(1)}" fill="rgb(225,215,170)" stroke="rgb(40,40,40)" stroke-width="2"/>`,
    );
    parts.push(`<circle cx="${(x + s / 2).toFixed(1)}" cy="${(y + s / 2).toFixed(1)}" r="${(s / 6).toFixed(1)}" fill="rgb(130,120,90)"/>`);
  }
  for (let i = 0; i < area / 3000; i++) {
    parts.push(`<circle cx="${(rnd() * width).toFixed(1)}" cy="${(rnd() * height).toFixed(1)}" r="${(1 + rnd() * 2.5).toFixed(1)}" fill="rgb(30,30,35)"/>`);
  }
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">${parts.join("")}</svg>`;
  const rgb = await sharp(Buffer.from(svg), { limitInputPixels: false }).removeAlpha().raw().toBuffer();
  const noise = seededGaussian(seed + 1);
  for (let i = 0; i < rgb.length; i += 3) {
    const n = noise() * 10;
    for (let c = 0; c < 3; c++) rgb[i + c] = Math.max(0, Math.min(255, rgb[i + c] + n));
  }
  if (blank) {
    for (let y = blank.y; y < blank.y + blank.height; y++) {
      for (let x = blank.x; x < blank.x + blank.width; x++) rgb.fill(110, (y * width + x) * 3, (y * width + x) * 3 + 3);
    }
  }
  return { rgb, width, height };
}

export type Rect = { x: number; y: number; width: number; height: number };

export type GridSpec = {
  rows: number;
  cols: number;
  order: CaptureOrder;
  frameWidth: number;
  frameHeight: number;
  overlapPercent: number;
  /** Largest position error of one frame, as a share of the frame (0.03 = ±3 %). */
  jitter: number;
  seed: number;
  /** Top-left of frame 0's nominal position in the scene. */
  origin: { x: number; y: number };
  /** Strength of the vignetting: brightness 1 − v·r² with r = 1 at the frame corners. */
  vignetting?: number;
  /** Standard deviation of each frame's sensor noise, in grey levels. */
  noise?: number;
  format?: "png" | "jpeg";
};

/** The scene size a grid needs, with room for its jitter. */
export function sceneSizeFor(spec: Omit<GridSpec, "seed">): { width: number; height: number } {
  const stepX = Math.round(spec.frameWidth * (1 - spec.overlapPercent / 100));
  const stepY = Math.round(spec.frameHeight * (1 - spec.overlapPercent / 100));
  const margin = (n: number) => Math.ceil(spec.jitter * n) + 1;
  return {
    width: spec.origin.x + (spec.cols - 1) * stepX + spec.frameWidth + margin(spec.frameWidth),
    height: spec.origin.y + (spec.rows - 1) * stepY + spec.frameHeight + margin(spec.frameHeight),
  };
}

/** Cuts the grid's frames from the scene into `dir`; returns their files (capture order) and true top-lefts. */
export async function cutFrames(scene: Scene, spec: GridSpec, dir: string): Promise<{ framePaths: string[]; truth: { x: number; y: number }[] }> {
  const rnd = seededRandom(spec.seed);
  const noise = seededGaussian(spec.seed + 7);
  const { frameWidth: fw, frameHeight: fh } = spec;
  const stepX = Math.round(fw * (1 - spec.overlapPercent / 100));
  const stepY = Math.round(fh * (1 - spec.overlapPercent / 100));
  const vig = spec.vignetting ?? 0.2;
  const sigma = spec.noise ?? 3;
  const shade = new Float32Array(fw * fh);
  for (let y = 0; y < fh; y++) {
    for (let x = 0; x < fw; x++) {
      const r2 = ((2 * (x + 0.5)) / fw - 1) ** 2 / 2 + ((2 * (y + 0.5)) / fh - 1) ** 2 / 2;
      shade[y * fw + x] = 1 - vig * r2;
    }
  }
  const framePaths: string[] = [];
  const truth: { x: number; y: number }[] = [];
  const frame = Buffer.alloc(fw * fh * 3);
  for (const cell of captureGrid(spec.rows, spec.cols, spec.order)) {
    const jx = Math.round((rnd() * 2 - 1) * spec.jitter * fw);
    const jy = Math.round((rnd() * 2 - 1) * spec.jitter * fh);
    const X = Math.max(0, spec.origin.x + cell.col * stepX + jx);
    const Y = Math.max(0, spec.origin.y + cell.row * stepY + jy);
    const brightness = 0.85 + 0.3 * rnd();
    for (let y = 0; y < fh; y++) {
      for (let x = 0; x < fw; x++) {
        const s = ((Y + y) * scene.width + X + x) * 3;
        const g = brightness * shade[y * fw + x];
        const n = noise() * sigma;
        for (let c = 0; c < 3; c++) frame[(y * fw + x) * 3 + c] = Math.max(0, Math.min(255, Math.round(scene.rgb[s + c] * g + n)));
      }
    }
    const file = path.join(dir, `frame-${String(cell.index).padStart(3, "0")}.${spec.format ?? "png"}`);
    const img = sharp(frame, { raw: { width: fw, height: fh, channels: 3 } });
    await (spec.format === "jpeg" ? img.jpeg({ quality: 90 }) : img.png({ compressionLevel: 1 })).toFile(file);
    framePaths.push(file);
    truth.push({ x: X, y: Y });
  }
  return { framePaths, truth };
}
