import { localMaxima, subPixelOffset, suppressNonMaxima, iou } from "@/lib/find-similar/peaks";
import { orient, scaledSize } from "@/lib/find-similar/raster";
import type { Gray, MatchCandidate, PixelSource, PxBox, Rotation } from "@/lib/find-similar/types";
import { ZnccPlan } from "@/lib/find-similar/zncc";

/**
 * Mark one, find the rest: zero-mean normalized cross-correlation (Lewis 1995, lib/find-similar/
 * zncc.ts) of the marked box over the micrograph, coarse to fine. The coarse pass correlates a
 * reduced copy of the image (a pyramid level) with every wanted variant of the template (quarter
 * turns, mirrored), block by block so memory stays bounded; each coarse peak is then refined at
 * full resolution in a small window around it, with a sub-pixel centre from a quadratic fit, and
 * non-maximum suppression leaves one candidate per feature.
 */

export type FindSimilarOptions = {
  minScore: number;
  rotations: Rotation[];
  mirrored: boolean;
  region?: PxBox;
  onProgress?: (percent: number) => void;
};

/** The coarse template's shorter side is kept at least this many px (finer detail is lost below). */
const MIN_COARSE_SIDE = 16;
const MAX_COARSE_FACTOR = 32;
/** Templates are refined at full resolution up to this side; larger ones at the scale that brings them to it. */
const MAX_REFINE_SIDE = 384;
/** Largest side of a coarse block read at once (its transforms are this size squared). */
const MAX_BLOCK = 2048;
/** Coarse peaks kept for refinement: far more than any die has pads or repeated cells to check. */
const MAX_COARSE_PEAKS = 4000;
/** The coarse pass keeps peaks this far below minScore: reduction lowers scores of fine detail. */
const COARSE_SLACK = 0.25;

type Variant = { rotation: Rotation; mirrored: boolean };

function checkBox(b: PxBox, w: number, h: number, what: string): void {
  const ints = [b.x, b.y, b.w, b.h].every(Number.isFinite);
  if (!ints || b.w < 2 || b.h < 2 || b.x < 0 || b.y < 0 || b.x + b.w > w || b.y + b.h > h) {
    throw new RangeError(`${what} must be at least 2×2 px and inside the ${w}×${h} px image`);
  }
}

/** The power-of-two reduction of the coarse pass for a template of this size. */
function coarseFactor(w: number, h: number): number {
  let f = 1;
  while (f < MAX_COARSE_FACTOR && Math.min(w, h) / (f * 2) >= MIN_COARSE_SIDE) f *= 2;
  return f;
}

type Coarse = { variant: number; u: number; v: number; score: number; centre: [number, number] };

export async function findSimilar(src: PixelSource, template: PxBox, opts: FindSimilarOptions): Promise<{ candidates: MatchCandidate[]; searchedPx: number }> {
  const { width: W, height: H } = src;
  checkBox(template, W, H, "the template box");
  if (!(opts.minScore >= 0 && opts.minScore <= 1)) throw new RangeError("minScore must be between 0 and 1");
  if (opts.rotations.length === 0) throw new RangeError("at least one rotation is needed");
  const region = opts.region ?? { x: 0, y: 0, w: W, h: H };
  checkBox(region, W, H, "the search region");
  const progress = opts.onProgress ?? (() => {});

  const variants: Variant[] = [];
  for (const rotation of [...new Set(opts.rotations)]) {
    variants.push({ rotation, mirrored: false });
    if (opts.mirrored) variants.push({ rotation, mirrored: true });
  }

  // --- coarse pass -------------------------------------------------------------------------
  const f = coarseFactor(template.w, template.h);
  const coarseT = await src.read(template, 1 / f);
  if (isFlat(coarseT)) throw new RangeError("the template box is uniform: there is nothing to match");
  const coarseVariants = variants.map((v) => orient(coarseT, v.rotation, v.mirrored));
  const tMax = Math.max(coarseT.width, coarseT.height);
  const tMin = Math.min(coarseT.width, coarseT.height);
  // The region in coarse px (the grid of the pyramid level: multiples of f in full px).
  const cx0 = Math.floor(region.x / f);
  const cy0 = Math.floor(region.y / f);
  const cx1 = Math.min(Math.floor(W / f), Math.ceil((region.x + region.w) / f));
  const cy1 = Math.min(Math.floor(H / f), Math.ceil((region.y + region.h) / f));
  const coarse: Coarse[] = [];
  if (cx1 - cx0 >= tMax && cy1 - cy0 >= tMax) {
    const step = MAX_BLOCK - tMax + 1; // output offsets per block; inputs overlap by tMax − 1
    const blocks: [number, number][] = [];
    for (let by = cy0; by <= cy1 - tMin; by += step) for (let bx = cx0; bx <= cx1 - tMin; bx += step) blocks.push([bx, by]);
    const threshold = Math.max(0.2, opts.minScore - COARSE_SLACK);
    for (let b = 0; b < blocks.length; b++) {
      const [bx, by] = blocks[b];
      const bw = Math.min(MAX_BLOCK, cx1 - bx);
      const bh = Math.min(MAX_BLOCK, cy1 - by);
      const img = await src.read({ x: bx * f, y: by * f, w: bw * f, h: bh * f }, 1 / f);
      const plan = new ZnccPlan(img);
      for (let i = 0; i < coarseVariants.length; i += 2) {
        const pair = coarseVariants.slice(i, i + 2).filter((t) => t.width <= img.width && t.height <= img.height);
        if (pair.length === 0) continue;
        const maps = plan.scores(pair[0], pair[1]);
        maps.forEach((map, k) => {
          const vi = coarseVariants.indexOf(pair[k]);
          const t = pair[k];
          for (const p of localMaxima(map, threshold, MAX_COARSE_PEAKS)) {
            // Offsets past the block's own output range belong to the next block.
            if (p.u >= step || p.v >= step) continue;
            const u = (bx + p.u) * f;
            const v = (by + p.v) * f;
            coarse.push({ variant: vi, u, v, score: p.score, centre: [u + (t.width * f) / 2, v + (t.height * f) / 2] });
          }
        });
      }
      progress(Math.round((50 * (b + 1)) / blocks.length));
    }
  }
  const coarsePeaks = suppressNonMaxima(coarse, tMin * f * 0.5).slice(0, MAX_COARSE_PEAKS);

  // --- refinement at full resolution --------------------------------------------------------
  const s = Math.min(1, MAX_REFINE_SIDE / Math.max(template.w, template.h));
  const fineT = await src.read(template, s);
  const fineVariants = variants.map((v) => orient(fineT, v.rotation, v.mirrored));
  const margin = Math.ceil(2 * f * s) + 2; // fine px around the coarse estimate
  const refined: MatchCandidate[] = [];
  for (let i = 0; i < coarsePeaks.length; i++) {
    const c = coarsePeaks[i];
    const r = refine(await readWindow(src, c, fineVariants[c.variant], s, margin), fineVariants[c.variant], s);
    if (r && r.score >= opts.minScore) {
      const v = variants[c.variant];
      const box = { x: r.x, y: r.y, w: fineVariants[c.variant].width / s, h: fineVariants[c.variant].height / s };
      refined.push({ box: roundBox(box, W, H), centre: [r.x + box.w / 2, r.y + box.h / 2], score: r.score, rotation: v.rotation, mirrored: v.mirrored });
    }
    if (i % 16 === 15) progress(50 + Math.round((50 * (i + 1)) / coarsePeaks.length));
  }
  progress(100);
  const inRegion = (m: MatchCandidate) =>
    m.centre[0] >= region.x && m.centre[0] <= region.x + region.w && m.centre[1] >= region.y && m.centre[1] <= region.y + region.h;
  const candidates = suppressNonMaxima(refined, Math.min(template.w, template.h) * 0.5).filter((m) => iou(m.box, template) < 0.5 && inRegion(m));
  return { candidates, searchedPx: region.w * region.h };
}

function isFlat(t: Gray): boolean {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of t.data) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return hi - lo < 1;
}

type Window = { img: Gray; x0: number; y0: number };

/** The full-resolution window (in fine px at scale s) around a coarse estimate. */
async function readWindow(src: PixelSource, c: Coarse, t: Gray, s: number, margin: number): Promise<Window | null> {
  const fx = Math.round(c.u * s) - margin;
  const fy = Math.round(c.v * s) - margin;
  const fw = Math.floor(src.width * s);
  const fh = Math.floor(src.height * s);
  const x0 = Math.max(0, fx);
  const y0 = Math.max(0, fy);
  const x1 = Math.min(fw, fx + t.width + 2 * margin);
  const y1 = Math.min(fh, fy + t.height + 2 * margin);
  if (x1 - x0 < t.width || y1 - y0 < t.height) return null;
  const box = { x: x0 / s, y: y0 / s, w: (x1 - x0) / s, h: (y1 - y0) / s };
  const img = await src.read(box, s);
  const [w, h] = scaledSize(box, s);
  if (img.width !== w || img.height !== h) throw new Error("pixel source gave the wrong size");
  return { img, x0, y0 };
}

/** Best position of `t` in the window, with its sub-pixel top-left corner in full-res px. */
function refine(win: Window | null, t: Gray, s: number): { x: number; y: number; score: number } | null {
  if (!win) return null;
  const map = new ZnccPlan(win.img).scores(t)[0];
  let best = 0;
  for (let i = 1; i < map.data.length; i++) if (map.data[i] > map.data[best]) best = i;
  const u = best % map.width;
  const v = Math.floor(best / map.width);
  const [dx, dy] = subPixelOffset(map, u, v);
  return { x: (win.x0 + u + dx) / s, y: (win.y0 + v + dy) / s, score: map.data[best] };
}

function roundBox(b: PxBox, W: number, H: number): PxBox {
  const x = Math.max(0, Math.min(W - 1, Math.round(b.x)));
  const y = Math.max(0, Math.min(H - 1, Math.round(b.y)));
  return { x, y, w: Math.min(Math.round(b.w), W - x), h: Math.min(Math.round(b.h), H - y) };
}
