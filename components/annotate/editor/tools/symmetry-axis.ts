import { newAxisName } from "../shape-factory";
import type { EditorContext, ToolState } from "../tool-state";
import { createAndSelect } from "./shared/create";
import { pathToolIdle, type PathToolSpec } from "./shared/drawing-path";

const SYMMETRY_AXIS: PathToolSpec = {
  tool: "symmetry_axis",
  kind: "symmetry_axis",
  closed: false,
  minPoints: 2,
  maxPoints: 2,
  complete(ctx, points, shift) {
    // One axis per die unless Shift asks for another (a die with several symmetric parts).
    const all = [...ctx.shapes().values()];
    const replacing = shift ? [] : all.filter((s) => s.kind === "symmetry_axis");
    const remaining = shift ? all : all.filter((s) => s.kind !== "symmetry_axis");
    const properties = { name: newAxisName(remaining) };
    createAndSelect(ctx, { kind: "symmetry_axis", geometry: { type: "LineString", coordinates: points }, properties }, replacing);
    return true;
  },
};

/** The symmetry axis tool: two clicks (or one drag) place the axis. */
export function symmetryAxisIdle(ctx: EditorContext): ToolState {
  return pathToolIdle(ctx, SYMMETRY_AXIS);
}
