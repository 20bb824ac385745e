import { z } from "zod";
import { ALIGNMENT_MODELS } from "@/lib/alignment/fit";
import { uuidSchema } from "./common";

/** Numbers as JSON carries them; NaN and infinities are refused by the solver with its message. */
const coordinate = z.number("coordinates must be numbers");
const xy = z.tuple([coordinate, coordinate], "a point is [x, y]");

const affineSchema = z.tuple([z.tuple([coordinate, coordinate, coordinate]), z.tuple([coordinate, coordinate, coordinate])]);

const controlPointPairSchema = z.strictObject({ imagePx: xy, dieUm: xy });

/** PUT /api/micrographs/{id}/alignment and its dry run. */
export const alignmentBodySchema = z.strictObject({
  model: z.enum(ALIGNMENT_MODELS, "model must be similarity or affine"),
  mirrored: z.boolean().optional(),
  pairs: z.array(controlPointPairSchema).max(200, "at most 200 control points"),
  /**
   * Store this transform instead of the fit (an accepted refinement); the pairs must still
   * determine a fit and their residuals are measured against this transform.
   */
  transform: affineSchema.optional(),
});
export type AlignmentBody = z.infer<typeof alignmentBodySchema>;

/** POST /api/micrographs/{id}/alignment/refine: what to start from (defaults: what is stored). */
export const refineBodySchema = z.strictObject({
  transform: affineSchema.optional(),
  pairs: z.array(controlPointPairSchema).max(200).optional(),
  againstId: uuidSchema.optional(),
});

/** PUT /api/dies/{id}/micrographs/order: every micrograph of the die, in the new order. */
export const micrographOrderSchema = z.strictObject({
  ids: z.array(uuidSchema).min(1).max(500),
});
