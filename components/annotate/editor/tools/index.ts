import type { EditorContext, ToolState } from "../tool-state";
import type { ToolId } from "../types";
import { blockIdle } from "./block";
import { dieOutlineIdle } from "./die-outline";
import { noteIdle } from "./note";
import { padIdle } from "./pad";
import { panIdle } from "./pan";
import { rulerIdle } from "./ruler";
import { selectIdle } from "./select/idle";
import { symmetryAxisIdle } from "./symmetry-axis";
import { traceIdle } from "./trace";
import { wireBondIdle } from "./wire-bond/idle";

const IDLE: Record<ToolId, (ctx: EditorContext) => ToolState> = {
  select: selectIdle,
  pan: panIdle,
  pad: padIdle,
  wire_bond: wireBondIdle,
  block: blockIdle,
  symmetry_axis: symmetryAxisIdle,
  trace: traceIdle,
  ruler: rulerIdle,
  note: noteIdle,
  die_outline: dieOutlineIdle,
};

/** The resting state of a tool, where every interaction with it begins and ends. */
export function idleState(tool: ToolId, ctx: EditorContext): ToolState {
  return IDLE[tool](ctx);
}
