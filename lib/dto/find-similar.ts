import type { JobStatus } from "./stored-values";

/** A box in one micrograph's pixels: (x, y) its top-left corner, y down. */
export type PxBoxDto = { x: number; y: number; w: number; h: number };
/** A box in the die frame, µm: (x, y) its lower-left corner, y up. */
export type UmBoxDto = { x: number; y: number; w: number; h: number };

/** One place that looks like the template, best first in a result. */
export type SimilarCandidateDto = {
  box: PxBoxDto;
  boxUm: UmBoxDto;
  centreUm: [number, number];
  /** Zero-mean normalized cross-correlation, −1 … 1 (1 = the same picture up to brightness and contrast). */
  score: number;
  rotation: 0 | 90 | 180 | 270;
  mirrored: boolean;
};

/** What a finished search found. `elapsedMs` is the search itself, not the wait in the queue. */
export type FindSimilarResult = { candidates: SimilarCandidateDto[]; searchedPx: number; elapsedMs: number };

/**
 * A search as POST answers it (202) and GET polls it: status and progress, then (done) the
 * result's fields beside them, or (failed) the reason.
 */
export type FindSimilarJobDto = {
  jobId: string;
  status: JobStatus;
  progress: number;
  error?: string;
  /** The kind the candidates would become (the template shape's, or the box's). */
  kind: "pad" | "block";
} & Partial<FindSimilarResult>;

/** POST /api/micrographs/{micrographId}/detect-die-edge: a proposed die outline, counter-clockwise from the lower-left. */
export type DieEdgeDto = { cornersPx: [number, number][]; cornersUm: [number, number][]; confidence: number };
