// Shapes of what the API answers; the server builds them, client components read them.
import type { AlignmentModel } from "@/lib/alignment/fit";
import type { Transform } from "@/lib/geometry/types";

/** A control point as stored and answered: where it is in the image and on the die. */
export type StoredControlPoint = { imagePx: [number, number]; dieUm: [number, number] };

/** A micrograph's alignment as the API shows it. */
export type AlignmentDto = {
  micrographId: string;
  isReference: boolean;
  model: AlignmentModel | null;
  mirrored: boolean;
  pairs: StoredControlPoint[];
  transform: Transform | null;
  residualsUm: number[];
  rmsUm: number | null;
  worstIndex: number | null;
};
