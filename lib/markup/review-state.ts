/** A shape's remark state from its remarks: any open remark → open; only closed ones (stored `resolved`) → resolved. */
export type ShapeReviewState = "open" | "resolved" | "none";
export const SHAPE_REVIEW_STATES: readonly ShapeReviewState[] = ["open", "resolved", "none"];
export const SHAPE_REVIEW_LABELS: Record<ShapeReviewState, string> = {
  open: "With open remarks",
  resolved: "With closed remarks only",
  none: "Without remarks",
};

/** Review state per shape id, for the shapes that have threads (others are "none"). */
export function reviewStates(threads: readonly { shapeId: string | null; status: "open" | "resolved" }[]): Map<string, ShapeReviewState> {
  const out = new Map<string, ShapeReviewState>();
  for (const t of threads) {
    if (!t.shapeId) continue;
    if (t.status === "open") out.set(t.shapeId, "open");
    else if (!out.has(t.shapeId)) out.set(t.shapeId, "resolved");
  }
  return out;
}
