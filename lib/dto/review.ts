// Shapes of what the API answers; the server builds them, client components read them.
import type { ReviewAction, ReviewStatus } from "@/lib/review/review-status";

export type ReviewEventDto = {
  id: string;
  action: ReviewAction;
  fromStatus: ReviewStatus;
  toStatus: ReviewStatus;
  message: string;
  /** The revision the move applied to. */
  revision: number;
  /** A sign-off over open remarks: the message says why. */
  overrideOpenRemarks: boolean;
  actorId: string | null;
  actorName: string | null;
  at: string;
};
