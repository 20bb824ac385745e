import { applyAffine, composeAffine, invertAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import { edgeMap } from "./edge-map";
import { phaseCorrelate } from "./phase-correlation";
import { resampleToGrid, type GreyImage } from "./resample";

/** A down-sampled micrograph and its image px → die µm transform (for those px). */
export type PlacedImage = { readonly image: GreyImage; readonly imageToDie: Affine2x3 };

export type TranslationRefinement = {
  /** The moving image's transform with the measured die-frame shift added. */
  readonly transform: Affine2x3;
  /** Die µm added to the moving transform's translation. */
  readonly shiftUm: readonly [number, number];
  /** Correlation peak height of the last pass (0…1); low values mean a weak match. */
  readonly peak: number;
  /** Die µm per grid px of the last pass. */
  readonly gridUm: number;
};

type Box = { minX: number; minY: number; maxX: number; maxY: number };

function dieBox({ image, imageToDie }: PlacedImage): Box {
  const corners = [
    [0, 0],
    [image.width, 0],
    [0, image.height],
    [image.width, image.height],
  ].map(([x, y]) => applyAffine(imageToDie, x, y));
  const xs = corners.map((c) => c[0]);
  const ys = corners.map((c) => c[1]);
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
}

/** Grid px → die µm for a y-down grid whose top-left corner is (minX, maxY), `s` µm per px. */
const gridToDie = (box: Box, s: number): Affine2x3 => [
  [s, 0, box.minX],
  [0, -s, box.maxY],
];

function onePass(reference: PlacedImage, moving: Affine2x3, movingImage: GreyImage, box: Box, size: number) {
  const s = Math.max(box.maxX - box.minX, box.maxY - box.minY) / size;
  const g = gridToDie(box, s);
  const a = resampleToGrid(reference.image, composeAffine(invertAffine(reference.imageToDie), g), size, size);
  const b = resampleToGrid(movingImage, composeAffine(invertAffine(moving), g), size, size);
  const shift = phaseCorrelate(edgeMap(a.data, size, size), edgeMap(b.data, size, size), size, size);
  // moving(grid) = reference(grid − d): the moving transform puts features d grid px off, i.e.
  // (d.x·s, −d.y·s) µm in the y-up die frame; subtract that from its translation.
  const du = -shift.dx * s;
  const dv = shift.dy * s;
  return { du, dv, peak: shift.peak, s };
}

/**
 * Refines the translation of a roughly aligned micrograph against an aligned one by phase
 * correlation of both, resampled into the die frame over the area they share. Passes run on a
 * coarse grid first, then finer grids, each starting from the last result. Throws when the
 * two do not overlap.
 */
export function refineTranslation(reference: PlacedImage, moving: PlacedImage, sizes: readonly number[] = [256, 512, 1024]): TranslationRefinement {
  const r = dieBox(reference);
  const m = dieBox(moving);
  const box = { minX: Math.max(r.minX, m.minX), minY: Math.max(r.minY, m.minY), maxX: Math.min(r.maxX, m.maxX), maxY: Math.min(r.maxY, m.maxY) };
  if (!(box.maxX > box.minX && box.maxY > box.minY)) throw new RangeError("the two micrographs do not overlap in the die frame");
  let t: Affine2x3 = moving.imageToDie;
  let total: [number, number] = [0, 0];
  let last = { peak: 0, s: 0 };
  for (const size of sizes) {
    const pass = onePass(reference, t, moving.image, box, size);
    t = [
      [t[0][0], t[0][1], t[0][2] + pass.du],
      [t[1][0], t[1][1], t[1][2] + pass.dv],
    ];
    total = [total[0] + pass.du, total[1] + pass.dv];
    last = pass;
  }
  return { transform: t, shiftUm: total, peak: last.peak, gridUm: last.s };
}
