import { applyAffine } from "@/lib/geometry/affine";
import { boundingBoxOf, type BoundingBox } from "@/lib/geometry/measure";
import type { Affine2x3, Position } from "@/lib/geometry/types";
import type { PxBoxDto, SimilarCandidateDto, UmBoxDto } from "@/lib/dto/find-similar";

/**
 * A template smaller than this on either side carries too few pixels for a correlation score
 * to mean anything (an 8 × 8 patch is 64 samples; fewer and noise alone reaches high scores).
 */
const MIN_TEMPLATE_PX = 8;
/** Largest template side: bounds the memory of one search (the template is read at full resolution). */
const MAX_TEMPLATE_PX = 4096;

type ImageSize = { readonly width: number; readonly height: number };

/** Why a template box cannot be searched for, or null when it can: too small, too large or not inside the image. */
export function templateBoxProblem(box: PxBoxDto, image: ImageSize): string | null {
  if (box.w < MIN_TEMPLATE_PX || box.h < MIN_TEMPLATE_PX) {
    return `The template is ${fmt(box.w)} × ${fmt(box.h)} px; it needs at least ${MIN_TEMPLATE_PX} × ${MIN_TEMPLATE_PX} px of the image.`;
  }
  if (box.w > MAX_TEMPLATE_PX || box.h > MAX_TEMPLATE_PX) {
    return `The template is ${fmt(box.w)} × ${fmt(box.h)} px; at most ${MAX_TEMPLATE_PX} px a side can be searched for.`;
  }
  return boxOutside(box, image) ? `The template box reaches outside the image (${image.width} × ${image.height} px).` : null;
}

/** Why a search region cannot be used, or null: it must lie inside the image and hold the template. */
export function regionProblem(region: PxBoxDto, template: PxBoxDto, image: ImageSize): string | null {
  if (boxOutside(region, image)) return `The search region reaches outside the image (${image.width} × ${image.height} px).`;
  const side = Math.min(template.w, template.h);
  if (region.w < side || region.h < side) return `The search region is ${fmt(region.w)} × ${fmt(region.h)} px, smaller than the template.`;
  return null;
}

const fmt = (v: number) => String(Math.round(v * 10) / 10);

function boxOutside(box: PxBoxDto, image: ImageSize): boolean {
  return box.x + box.w > image.width || box.y + box.h > image.height;
}

/**
 * The pixel box of a die-frame shape on one micrograph: its vertices mapped through the
 * inverse of the micrograph's transform, then their bounding box, clipped to the image and
 * rounded outwards to whole pixels. Null when nothing of it lies on the image.
 */
export function shapeBoxPx(ring: readonly Position[], dieToImage: Affine2x3, image: ImageSize): PxBoxDto | null {
  const b = boundingBoxOf(ring.map(([x, y]) => applyAffine(dieToImage, x, y)));
  const x0 = Math.max(0, Math.floor(b.minX));
  const y0 = Math.max(0, Math.floor(b.minY));
  const x1 = Math.min(image.width, Math.ceil(b.maxX));
  const y1 = Math.min(image.height, Math.ceil(b.maxY));
  return x1 > x0 && y1 > y0 ? { x: x0, y: y0, w: x1 - x0, h: y1 - y0 } : null;
}

/** The die-frame box (lower-left corner, y up) covering a pixel box. */
export function umBoxOf(box: PxBoxDto, imageToDie: Affine2x3): UmBoxDto {
  const corners: Position[] = [
    [box.x, box.y],
    [box.x + box.w, box.y],
    [box.x + box.w, box.y + box.h],
    [box.x, box.y + box.h],
  ];
  const b = boundingBoxOf(corners.map(([x, y]) => applyAffine(imageToDie, x, y)));
  return { x: b.minX, y: b.minY, w: b.maxX - b.minX, h: b.maxY - b.minY };
}

type EngineCandidate = { box: PxBoxDto; centre: [number, number]; score: number; rotation: 0 | 90 | 180 | 270; mirrored: boolean };

/**
 * A found candidate as the API answers it. With `sizeUm` (the template shape's own size in
 * µm) the die box is that size, turned with the candidate's quarter turn, centred on the
 * candidate's sub-pixel centre, so an added shape is exactly as large as the one marked.
 */
export function candidateInDie(c: EngineCandidate, imageToDie: Affine2x3, sizeUm?: readonly [number, number]): SimilarCandidateDto {
  const centreUm = applyAffine(imageToDie, c.centre[0], c.centre[1]);
  let boxUm = umBoxOf(c.box, imageToDie);
  if (sizeUm) {
    const [w, h] = c.rotation === 90 || c.rotation === 270 ? [sizeUm[1], sizeUm[0]] : sizeUm;
    boxUm = { x: centreUm[0] - w / 2, y: centreUm[1] - h / 2, w, h };
  }
  return { box: c.box, boxUm, centreUm, score: c.score, rotation: c.rotation, mirrored: c.mirrored };
}

/** Share of the smaller box that two boxes have in common (0 … 1). */
export function overlapShare(a: UmBoxDto, b: BoundingBox): number {
  const w = Math.min(a.x + a.w, b.maxX) - Math.max(a.x, b.minX);
  const h = Math.min(a.y + a.h, b.maxY) - Math.max(a.y, b.minY);
  if (w <= 0 || h <= 0) return 0;
  const smaller = Math.min(a.w * a.h, (b.maxX - b.minX) * (b.maxY - b.minY));
  return smaller > 0 ? (w * h) / smaller : 0;
}

/**
 * A candidate counts as already marked when a quarter of it (or of the marked shape, if
 * smaller) is covered by a shape of the same kind: hand-drawn outlines are a few µm off, and
 * neighbouring pads at their pitch never share that much.
 */
const MARKED_OVERLAP = 0.25;

/** The candidates not already covered by one of `marked` (bounding boxes of existing shapes of the kind). */
export function withoutMarked<C extends { boxUm: UmBoxDto }>(candidates: readonly C[], marked: readonly BoundingBox[]): C[] {
  return candidates.filter((c) => !marked.some((m) => overlapShare(c.boxUm, m) >= MARKED_OVERLAP));
}
