import type { ReviewStatus } from "./stored-values";
import type { PadTable } from "@/lib/pads/types";
import type { Transform } from "@/lib/geometry/types";

/** One revision of a die's markup as GET /api/dies/{dieId}/revisions lists it. */
export type RevisionDto = {
  readonly number: number;
  /** A frozen revision is signed_off; the revision being drawn has the die's check status. */
  readonly status: ReviewStatus;
  readonly signedOffBy?: string;
  readonly signedOffAt?: string;
  readonly sha256?: string;
  readonly shapeCount: number;
};

/** The pad table at sign-off, or why there was none (no outline and no size, say). */
export type FrozenPadTable = { readonly table: PadTable } | { readonly unavailable: string };

/** The die frame at sign-off: its recorded size and the reference micrograph's placement. */
export type FrozenDieFrame = {
  readonly widthUm: number | null;
  readonly heightUm: number | null;
  readonly reference: {
    readonly micrographId: string;
    readonly label: string;
    readonly transform: Transform | null;
    readonly scaleUmPerPx: number | null;
  } | null;
};

/** What every export states about the revision it shows. */
export type RevisionStamp = {
  readonly number: number;
  readonly status: ReviewStatus;
  readonly signedOffBy: string | null;
  readonly signedOffAt: string | null;
};
