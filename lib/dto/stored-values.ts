// The enumerated values the database stores and the API answers: one TypeScript source for
// the pgEnum columns in db/schema.ts, the zod schemas and the types client code reads.
export { ROLES } from "@/lib/auth/permissions";
import { ILLUMINATIONS } from "@/lib/validation/micrographs";
export { ILLUMINATIONS };
export type Illumination = (typeof ILLUMINATIONS)[number];
export { MARKUP_KINDS } from "@/lib/markup/types";

/**
 * A die's check, in the words of engineering drawing checks (drawn → checked → signed off):
 * being drawn, with the checker, signed off, or returned with remarks.
 */
export const REVIEW_STATUSES = ["draft", "with_checker", "signed_off", "returned"] as const;
export type ReviewStatus = (typeof REVIEW_STATUSES)[number];
export const REVIEW_ACTIONS = ["send", "withdraw", "sign_off", "return"] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];

/** A micrograph's pyramid: waiting for a worker, being built, servable, or given up. */
export const MICROGRAPH_STATUSES = ["queued", "tiling", "ready", "failed"] as const;
export type MicrographStatus = (typeof MICROGRAPH_STATUSES)[number];

/** A background job, and an export (which is one). */
export const JOB_STATUSES = ["queued", "running", "done", "failed"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

export const THREAD_STATUSES = ["open", "resolved"] as const;
export type ThreadStatus = (typeof THREAD_STATUSES)[number];

export const OUTBOX_STATUSES = ["pending", "sent", "failed"] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

export const EXPORT_KINDS = ["annotated_png", "report_pdf"] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];

/** How a sample was opened or prepared (a case's sample record). */
export const PREPARATION_METHODS = [
  "acid_decap",
  "laser_decap",
  "plasma_etch",
  "mechanical_polish",
  "delid",
  "delayer_wet",
  "delayer_rie",
  "cross_section",
  "other",
] as const;
export type PreparationMethod = (typeof PREPARATION_METHODS)[number];

/** What happened to a sample in its chain of custody. */
export const CUSTODY_ACTIONS = ["received", "transferred", "stored", "checked_out", "returned", "destroyed"] as const;
export type CustodyAction = (typeof CUSTODY_ACTIONS)[number];
