import { z } from "zod";
import { CUSTODY_ACTIONS, PREPARATION_METHODS } from "@/lib/dto/stored-values";
import { line } from "./common";

/**
 * A date or date-time in ISO 8601: `2026-11-20` (read as midnight UTC, as ECMAScript reads a
 * date-only form) or a date-time with its offset (`…T14:30:00Z`, `…+01:00`). Stored and
 * answered as the UTC instant, so the API always gives back one form.
 */
const isoInstant = z
  .union([z.iso.date(), z.iso.datetime({ offset: true })], { error: "must be an ISO 8601 date (2026-11-20) or date-time with offset" })
  .transform((s) => new Date(s).toISOString());

const notes = z.string().trim().max(4000, "must be at most 4000 characters");

/** One preparation step of the sample record. */
const preparationStepSchema = z.strictObject({
  method: z.enum(PREPARATION_METHODS, { error: `must be one of ${PREPARATION_METHODS.join(", ")}` }),
  chemicals: line(300),
  equipment: line(300),
  performedBy: line(200),
  performedAt: isoInstant.nullable(),
  notes,
});

/** The whole sample record as PUT writes it; shared by the form (zodResolver) and the API. */
export const sampleRecordSchema = z.strictObject({
  receivedAt: isoInstant.nullable(),
  receivedFrom: line(200),
  condition: line(500),
  storageLocation: line(200),
  preparation: z.array(preparationStepSchema).max(50, "must have at most 50 steps"),
});
export type SampleRecordInput = z.input<typeof sampleRecordSchema>;
export type SampleRecordOutput = z.output<typeof sampleRecordSchema>;

/** A new chain-of-custody entry. Who and when are the server's: `at` or `actorId` here are refused. */
export const custodyEntrySchema = z.strictObject({
  action: z.enum(CUSTODY_ACTIONS, { error: `must be one of ${CUSTODY_ACTIONS.join(", ")}` }),
  to: line(200).optional().default(""),
  location: line(200).optional().default(""),
  note: notes,
});
export type CustodyEntryInput = z.input<typeof custodyEntrySchema>;
export type CustodyEntryOutput = z.output<typeof custodyEntrySchema>;
