import { polylineLength } from "@/lib/geometry/measure";
import type { Position } from "@/lib/geometry/types";
import type { EditorContext, ToolState } from "../../tool-state";
import type { PathKind, PointerInput, ToolId } from "../../types";

/** What makes one click-by-click tool differ from another. */
export type PathToolSpec = {
  readonly tool: ToolId;
  readonly kind: PathKind;
  /** A closed path (a block) also finishes on a click near its first vertex. */
  readonly closed: boolean;
  readonly minPoints: number;
  /** The path finishes by itself at this many vertices (the symmetry axis: 2). */
  readonly maxPoints: number | null;
  /**
   * Creates the shape from the finished vertices (Shift held on any click is passed on).
   * Returns false when the vertices make no valid shape; the drawing then goes on.
   */
  complete(ctx: EditorContext, points: readonly Position[], shift: boolean): boolean;
};

const near = (a: Position, b: Position, toleranceUm: number) => Math.hypot(a[0] - b[0], a[1] - b[1]) <= toleranceUm;

/** A click-by-click tool at rest: the first press places the first vertex. */
export function pathToolIdle(ctx: EditorContext, spec: PathToolSpec): ToolState {
  return {
    name: `${spec.tool}.idle`,
    pointerDown(e) {
      ctx.transition(drawingPath(ctx, spec, e));
    },
  };
}

/**
 * Placing vertices one press at a time. A press within the tolerance of the last vertex adds
 * nothing (the second press of a double click); a first press dragged out and released places
 * the second vertex at the release. The preview carries the live length up to the cursor.
 */
function drawingPath(ctx: EditorContext, spec: PathToolSpec, first: PointerInput): ToolState {
  const points: Position[] = [[first.x, first.y]];
  let cursor: Position | null = null;
  let toleranceUm = first.toleranceUm;
  let shift = first.shift;
  let firstPressDown = true;

  const closesAt = (p: Position | null) => spec.closed && p !== null && points.length >= 3 && near(p, points[0], toleranceUm);
  const refresh = () => {
    const path = cursor ? [...points, cursor] : points;
    ctx.setPreview({ type: "path", kind: spec.kind, points: [...points], cursor, lengthUm: polylineLength(path), closesOnClick: closesAt(cursor) });
  };
  const tryComplete = () => {
    if (points.length >= spec.minPoints) spec.complete(ctx, [...points], shift);
  };
  const place = (p: Position) => {
    if (closesAt(p)) return tryComplete();
    if (near(p, points[points.length - 1], toleranceUm)) return;
    points.push(p);
    if (spec.maxPoints !== null && points.length >= spec.maxPoints) return tryComplete();
    refresh();
  };

  const state: ToolState = {
    name: `${spec.tool}.drawing_path`,
    drawing: true,
    interacting: true,
    pointerDown(e) {
      toleranceUm = e.toleranceUm;
      shift ||= e.shift;
      place([e.x, e.y]);
    },
    pointerMove(e) {
      toleranceUm = e.toleranceUm;
      cursor = [e.x, e.y];
      refresh();
    },
    pointerUp(e) {
      if (!firstPressDown) return;
      firstPressDown = false;
      if (points.length === 1 && !near([e.x, e.y], points[0], e.toleranceUm)) state.pointerDown?.(e);
    },
    doubleClick: tryComplete,
    finish: tryComplete,
    removeLastPoint() {
      points.pop();
      if (points.length > 0) return refresh();
      ctx.setPreview(null);
      ctx.toIdle();
    },
  };
  refresh();
  return state;
}
