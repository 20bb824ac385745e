import { z } from "zod";
import { line } from "./common";

/** A case: the part under study. Shared by the form (zodResolver) and the API (safeParse). */
export const caseInputSchema = z.strictObject({
  title: line(200).min(1, "a title is required"),
  partMarking: line(200).default(""),
  package: line(100).default(""),
  sampleId: line(100).default(""),
  notes: z.string().max(10_000, "must be at most 10000 characters").default(""),
});

export const casePatchSchema = z.strictObject({
  title: line(200).min(1, "a title is required").optional(),
  partMarking: line(200).optional(),
  package: line(100).optional(),
  sampleId: line(100).optional(),
  notes: z.string().max(10_000, "must be at most 10000 characters").optional(),
});
export type CasePatch = z.infer<typeof casePatchSchema>;
