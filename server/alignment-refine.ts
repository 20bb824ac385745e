import "server-only";
import sharp from "sharp";
import { composeAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { alignmentResiduals, type ControlPointPair } from "@/lib/alignment";
import { refineTranslation } from "@/lib/alignment/refine-translation";
import { judgeRefinement, MIN_MATCH_STRENGTH } from "@/lib/alignment/refinement-verdict";
import type { GreyImage } from "@/lib/alignment/resample";
import { configureSharp, sharpInputOptions } from "@/server/images/limits";
import { BadRequestError } from "@/lib/errors";
import { micrographKeys } from "./storage/keys";
import { localCopy } from "./storage";
import type { MicrographRow } from "@/db/schema";
import type { Transform } from "@/lib/geometry/types";

/** Longest side the previews are reduced to before correlating: enough detail, quick FFTs. */
const WORK_SIDE = 1024;

/** A micrograph's preview as a greyscale raster with its own px → die µm transform. */
async function placedPreview(row: MicrographRow, imageToDie: Affine2x3) {
  configureSharp();
  const file = await localCopy(micrographKeys(row.dieId, row.id).preview);
  if (!file) throw new BadRequestError("Both micrographs need their preview before refining: wait until they are processed.");
  const { data, info } = await sharp(file.path, sharpInputOptions())
    .resize({ width: WORK_SIDE, height: WORK_SIDE, fit: "inside", withoutEnlargement: true })
    .greyscale()
    .raw()
    .toBuffer({ resolveWithObject: true })
    .finally(file.release);
  const image: GreyImage = { width: info.width, height: info.height, data };
  // Work px → full-resolution px, then the micrograph's transform.
  const toFull: Affine2x3 = [
    [row.width! / info.width, 0, 0],
    [0, row.height! / info.height, 0],
  ];
  return { image, imageToDie: composeAffine(imageToDie, toFull) };
}

const plain = (t: Affine2x3): Transform => [
  [t[0][0], t[0][1], t[0][2]],
  [t[1][0], t[1][1], t[1][2]],
];

/**
 * Proposes a refined transform for a roughly aligned micrograph by phase correlation of both
 * previews in the die frame: the rough transform with its translation corrected, and the RMS
 * on the control points before and after. Nothing is stored; the analyst accepts or discards it.
 * `proposed` says whether it may be offered at all: only when the match is strong enough
 * (`peak` ≥ `minMatchStrength`) and the RMS on the control points did not get worse.
 */
export async function proposeRefinement(moving: MicrographRow, against: MicrographRow, rough: Affine2x3, pairs: readonly ControlPointPair[]) {
  if (!moving.width || !moving.height || !against.width || !against.height) throw new BadRequestError("Both micrographs must have been read before refining.");
  const reference = await placedPreview(against, against.transform!);
  const mov = await placedPreview(moving, rough);
  let result;
  try {
    result = refineTranslation(reference, mov);
  } catch (e) {
    throw new BadRequestError(`Refinement refused: ${(e as Error).message}.`);
  }
  // The refined transform is expressed back in full-resolution px: only the translation changed.
  const transform: Affine2x3 = [
    [rough[0][0], rough[0][1], rough[0][2] + result.shiftUm[0]],
    [rough[1][0], rough[1][1], rough[1][2] + result.shiftUm[1]],
  ];
  const before = pairs.length ? alignmentResiduals(rough, pairs) : null;
  const after = pairs.length ? alignmentResiduals(transform, pairs) : null;
  const rmsBeforeUm = before?.rmsUm ?? null;
  const rmsAfterUm = after?.rmsUm ?? null;
  const verdict = judgeRefinement({ rmsBeforeUm, rmsAfterUm, peak: result.peak });
  return {
    againstId: against.id,
    transform: plain(transform),
    shiftUm: [result.shiftUm[0], result.shiftUm[1]],
    peak: result.peak,
    minMatchStrength: MIN_MATCH_STRENGTH,
    rmsBeforeUm,
    rmsAfterUm,
    residualsUm: after?.residualsUm ?? [],
    improved: verdict.improved,
    strongEnough: verdict.strongEnough,
    proposed: verdict.proposed,
    reason: verdict.reason,
  };
}
