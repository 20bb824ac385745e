import { z } from "zod";
import { line } from "./common";

/** A die dimension: positive, finite, at most 100 mm (no die is larger than a reticle). */
const dimension = z.number("must be a number").finite("must be finite").positive("must be positive").max(100_000, "must be at most 100000 µm").nullable();

export const dieInputSchema = z.strictObject({
  name: line(200).min(1, "a name is required"),
  widthUm: dimension.default(null),
  heightUm: dimension.default(null),
  notes: z.string().max(10_000, "must be at most 10000 characters").default(""),
});

export const diePatchSchema = z.strictObject({
  name: line(200).min(1, "a name is required").optional(),
  widthUm: dimension.optional(),
  heightUm: dimension.optional(),
  notes: z.string().max(10_000, "must be at most 10000 characters").optional(),
});
export type DiePatch = z.infer<typeof diePatchSchema>;
