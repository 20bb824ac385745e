import type { CompareMode } from "./compare-view";

/** What the die bench's work area shows: one micrograph, the alignment split view, or a comparison. */
export type WorkMode =
  { kind: "view" } | { kind: "align"; movingId: string; fixedId: string } | { kind: "compare"; topId: string; bottomId: string; mode: CompareMode };
