import { z } from "zod";
import { uuidSchema } from "./common";
import { MARKUP_KINDS } from "@/lib/markup/types";
import { MAX_OUTPUT_PX } from "@/lib/export/render-plan";
import { UNKNOWN_DIE_LIMIT_UM } from "@/lib/markup/die-bounds";

const um = z
  .number("must be a number")
  .finite("must be finite")
  .min(-UNKNOWN_DIE_LIMIT_UM, `must be within ±${UNKNOWN_DIE_LIMIT_UM} µm`)
  .max(UNKNOWN_DIE_LIMIT_UM, `must be within ±${UNKNOWN_DIE_LIMIT_UM} µm`);
const size = z
  .number("must be a number")
  .finite("must be finite")
  .positive("must be positive")
  .max(2 * UNKNOWN_DIE_LIMIT_UM, "is too large");

/** POST /api/dies/{dieId}/exports: an annotated PNG of a region of one micrograph. */
export const exportRequestSchema = z
  .strictObject({
    micrographId: uuidSchema,
    /** Die µm, lower-left corner; absent = the whole die. */
    region: z.strictObject({ x: um, y: um, width: size, height: size }).optional(),
    widthPx: z
      .number("must be a number")
      .int("must be a whole number")
      .min(16, "must be at least 16")
      .max(MAX_OUTPUT_PX, `must be at most ${MAX_OUTPUT_PX}`)
      .optional(),
    umPerPx: z.number("must be a number").finite("must be finite").positive("must be positive").max(100_000, "is too coarse").optional(),
    kinds: z
      .array(z.enum(MARKUP_KINDS, `must be one of ${MARKUP_KINDS.join(", ")}`))
      .max(MARKUP_KINDS.length * 2)
      .optional(),
    labels: z.boolean("must be true or false").default(true),
    threads: z.boolean("must be true or false").default(false),
  })
  .refine((r) => !(r.widthPx !== undefined && r.umPerPx !== undefined), { message: "give widthPx or umPerPx, not both", path: ["umPerPx"] });
export type ExportRequest = z.infer<typeof exportRequestSchema>;
