"use client";

import type { MicrographDto, MosaicStage } from "@/lib/dto/micrographs";

/** The stages a mosaic goes through, in order, with the words the user reads. */
const STAGE_STEPS = [
  { stage: "checking", label: "Checking frames" },
  { stage: "registering", label: "Registering pairs" },
  { stage: "placing", label: "Placing frames" },
  { stage: "composing", label: "Composing" },
  { stage: "tiling", label: "Tiling" },
] as const satisfies readonly { stage: MosaicStage; label: string }[];

/** The current stage and its progress; the tiling stage's progress is the micrograph's own (the ordinary tile job's). */
function current(m: MicrographDto): { index: number; percent: number } {
  const mo = m.mosaic!;
  if (mo.stage === "done") return { index: STAGE_STEPS.length, percent: 100 };
  const index = Math.max(
    0,
    STAGE_STEPS.findIndex((s) => s.stage === mo.stage),
  );
  const tilingOwn = mo.stage === "tiling" && !mo.restitching;
  return { index, percent: tilingOwn ? m.progress : mo.stageProgress };
}

/** One line for the micrograph list: which stage a mosaic is at, with its progress. */
export function MosaicStageLine({ m }: { m: MicrographDto }) {
  const { index, percent } = current(m);
  const step = STAGE_STEPS[Math.min(index, STAGE_STEPS.length - 1)];
  const prefix = m.mosaic?.restitching ? "Stitching again: " : m.status === "queued" && m.mosaic?.stage === "checking" && percent === 0 ? "Waiting: " : "";
  return (
    <span className="flex flex-col gap-1" data-testid="mosaic-stage">
      <span className="text-ink-300">
        {prefix}
        {step.label} {percent} %{" "}
        <span className="text-ink-500">
          (stage {Math.min(index + 1, STAGE_STEPS.length)} of {STAGE_STEPS.length})
        </span>
      </span>
      <progress aria-label={`${step.label} progress of ${m.label}`} max={100} value={percent} className="h-1.5 w-full accent-kerf-500" />
    </span>
  );
}

/** Whether the list should show the stage instead of the ordinary tiling status. */
export const showsStage = (m: MicrographDto) =>
  !!m.mosaic && m.status !== "failed" && (m.mosaic.restitching || (m.status !== "ready" && m.mosaic.stage !== "done"));

/** The stages as a checklist (the upload dialog, after the frames are sent): done, under way, to come. */
export function MosaicStageSteps({ m }: { m: MicrographDto }) {
  const { index, percent } = current(m);
  return (
    <ol aria-label="Stitching stages" className="flex flex-col gap-1 text-sm" data-testid="mosaic-stages">
      {STAGE_STEPS.map((s, i) => {
        const state = i < index ? "done" : i === index ? "current" : "waiting";
        return (
          <li
            key={s.stage}
            data-state={state}
            className={`flex items-center gap-2 ${state === "waiting" ? "text-ink-500" : state === "done" ? "text-ok-400" : "text-ink-100"}`}
          >
            <span aria-hidden="true" className="w-4 text-center">
              {state === "done" ? "✓" : state === "current" ? "›" : "·"}
            </span>
            <span>{s.label}</span>
            {state === "current" && (
              <>
                <progress aria-label={`${s.label} progress`} max={100} value={percent} className="h-1.5 w-28 accent-kerf-500" />
                <span className="text-xs text-ink-300">{percent} %</span>
              </>
            )}
            <span className="sr-only">{state === "done" ? "(done)" : state === "current" ? "(under way)" : "(to come)"}</span>
          </li>
        );
      })}
    </ol>
  );
}
