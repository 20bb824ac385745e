import { z } from "zod";
import { uuidSchema } from "./common";

/** The quarter turns a template may be tried at. */
const SEARCH_ROTATIONS = [0, 90, 180, 270] as const;
/** The kinds a search finds: the repeated features an analyst marks. */
export const SEARCHABLE_KINDS = ["pad", "block"] as const;

/** Largest image coordinate accepted: far beyond any micrograph the pixel cap lets in. */
const MAX_COORD_PX = 1_000_000;
const px = z.number("must be a number").finite("must be finite").min(0, "must not be negative").max(MAX_COORD_PX, "is too large");
const sidePx = z.number("must be a number").finite("must be finite").min(0, "must not be negative").max(MAX_COORD_PX, "is too large");

/** A box in one micrograph's pixels: (x, y) its top-left corner, y down. */
const pxBoxSchema = z.strictObject({ x: px, y: px, w: sidePx, h: sidePx });

const options = {
  minScore: z.number("must be a number").finite("must be finite").min(0, "must be between 0 and 1").max(1, "must be between 0 and 1").default(0.7),
  rotations: z
    .array(z.union(SEARCH_ROTATIONS.map((r) => z.literal(r))), "must be a list of 0, 90, 180 and 270")
    .min(1, "must hold at least one of 0, 90, 180, 270")
    .max(4, "must hold each of 0, 90, 180, 270 at most once")
    .refine((r) => new Set(r).size === r.length, "must not repeat a rotation")
    .default([...SEARCH_ROTATIONS]),
  mirrored: z.boolean("must be true or false").default(true),
  region: pxBoxSchema.optional(),
};

/**
 * POST /api/micrographs/{micrographId}/find-similar: the template is a pad or block of the
 * micrograph's die (`shapeId`) or a box of its pixels (`box`, with the `kind` the candidates
 * would become, default pad), exactly one of the two. One object (not a union) so a wrong
 * field is named in the message.
 */
export const findSimilarSchema = z
  .strictObject({
    shapeId: uuidSchema.optional(),
    box: pxBoxSchema.optional(),
    kind: z.enum(SEARCHABLE_KINDS, "must be pad or block").optional(),
    ...options,
  })
  .superRefine((r, ctx) => {
    if ((r.shapeId === undefined) === (r.box === undefined))
      ctx.addIssue({ code: "custom", path: ["shapeId"], message: "give a shapeId or a box, one of the two" });
    if (r.shapeId !== undefined && r.kind !== undefined)
      ctx.addIssue({ code: "custom", path: ["kind"], message: "comes from the shape; give it only with a box" });
  });
export type FindSimilarRequest = z.infer<typeof findSimilarSchema>;
