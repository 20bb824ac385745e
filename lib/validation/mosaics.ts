import { z } from "zod";

/** The most frames one mosaic takes (a 20 × 20 grid): beyond that, stitch in parts. */
export const MAX_MOSAIC_FRAMES = 400;
/** Nominal overlap between neighbouring frames, percent of a frame (the registration searches only inside it). */
export const OVERLAP_RANGE = { min: 5, max: 60 } as const;
const CAPTURE_ORDERS = ["rows", "serpentine"] as const;

// Multipart fields arrive as strings; the form sends numbers. Both pass through the same checks.
const whole = (label: string, max: number) =>
  z.coerce
    .number(`${label} must be a number`)
    .int(`${label} must be a whole number`)
    .min(1, `${label} must be at least 1`)
    .max(max, `${label} must be at most ${max}`);

const onOff = z.preprocess(
  (v) =>
    typeof v === "string"
      ? (({ true: true, on: true, "1": true, false: false, off: false, "0": false } as Record<string, boolean>)[v.trim().toLowerCase()] ?? v)
      : v,
  z.boolean("flatField must be true or false"),
);

/** The grid of a mosaic upload (and of a stitch again, where every field may change but the grid). */
export const mosaicGridSchema = z
  .strictObject({
    rows: whole("rows", 50),
    cols: whole("cols", 50),
    order: z.enum(CAPTURE_ORDERS, "order must be rows or serpentine"),
    overlapPercent: z.coerce
      .number("overlapPercent must be a number")
      .finite("overlapPercent must be a number")
      .min(OVERLAP_RANGE.min, `overlapPercent must be between ${OVERLAP_RANGE.min} and ${OVERLAP_RANGE.max}`)
      .max(OVERLAP_RANGE.max, `overlapPercent must be between ${OVERLAP_RANGE.min} and ${OVERLAP_RANGE.max}`),
    /** Shading correction from the frames' median; when absent, on for bright field. */
    flatField: onOff.optional(),
  })
  .refine((g) => g.rows * g.cols >= 2, { message: "a mosaic needs at least two frames", path: ["cols"] })
  .refine((g) => g.rows * g.cols <= MAX_MOSAIC_FRAMES, { message: `a mosaic takes at most ${MAX_MOSAIC_FRAMES} frames`, path: ["cols"] });

/** POST /api/micrographs/{id}/mosaic/restitch: stitch the same frames again with another overlap, order or shading choice. */
export const restitchSchema = z
  .strictObject({
    order: z.enum(CAPTURE_ORDERS, "order must be rows or serpentine").optional(),
    overlapPercent: z
      .number("overlapPercent must be a number")
      .finite()
      .min(OVERLAP_RANGE.min, `overlapPercent must be between ${OVERLAP_RANGE.min} and ${OVERLAP_RANGE.max}`)
      .max(OVERLAP_RANGE.max, `overlapPercent must be between ${OVERLAP_RANGE.min} and ${OVERLAP_RANGE.max}`)
      .optional(),
    flatField: z.boolean("flatField must be true or false").optional(),
  })
  .refine((b) => b.order !== undefined || b.overlapPercent !== undefined || b.flatField !== undefined, {
    message: "change the order, the overlap or flatField",
  });
export type Restitch = z.infer<typeof restitchSchema>;

/** The multipart fields of a mosaic upload that describe the grid; the rest are a micrograph's capture data. */
export const GRID_FIELDS = ["rows", "cols", "order", "overlapPercent", "flatField"] as const;
