"use client";

import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { captureSchema, ILLUMINATIONS, ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import { mosaicGridSchema, OVERLAP_RANGE } from "@/lib/validation/mosaics";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { CapturePathDiagram } from "./capture-path";
import { FrameList, type PickedFrame } from "./frame-list";
import { MosaicStageSteps } from "./mosaic-stage";
import { useMosaicUpload } from "./use-mosaic-upload";

// The same schemas as the server's: the grid's and a micrograph upload's capture data.
const formSchema = z.object({ grid: mosaicGridSchema, capture: captureSchema });
type Values = z.input<typeof formSchema>;
type Output = z.output<typeof formSchema>;

const SELECT = "rounded-md border border-ink-700 bg-ink-900 px-2 py-1.5 text-sm";

/** The multipart fields: every value given, as text. */
function asFields(v: Output): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, val] of Object.entries({ ...v.grid, ...v.capture })) if (val !== undefined && val !== "") out[k] = String(val);
  return out;
}

/**
 * The mosaic upload: frames (naturally sorted, reorderable), the grid and its capture order with
 * a diagram of the path, the nominal overlap and the capture data; then per-frame upload
 * progress and the stitching stages until the mosaic is ready.
 */
export function UploadMosaic({
  dieId,
  onAccepted,
  onDone,
  onCancel,
}: {
  dieId: string;
  onAccepted: () => void;
  onDone: (m: MicrographDto) => void;
  onCancel: () => void;
}) {
  const [frames, setFrames] = useState<PickedFrame[]>([]);
  const [error, setError] = useState<string | null>(null);
  const upload = useMosaicUpload(dieId);
  const { register, handleSubmit, control, formState } = useForm<Values, unknown, Output>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      grid: { rows: "3", cols: "3", order: "serpentine", overlapPercent: "20", flatField: true },
      capture: { label: "", illumination: "bright_field", scaleUmPerPx: "" },
    },
  });
  const [rawRows, rawCols, rawOrder] = useWatch({ control, name: ["grid.rows", "grid.cols", "grid.order"] });
  const rows = Number(rawRows);
  const cols = Number(rawCols);
  const order = rawOrder === "rows" ? "rows" : "serpentine";
  const need = Number.isInteger(rows * cols) ? rows * cols : 0;
  const busy = formState.isSubmitting;
  const s = upload.state;
  const e = formState.errors;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit(async (v) => {
        if (frames.length !== v.grid.rows * v.grid.cols)
          return setError(`A ${v.grid.rows} × ${v.grid.cols} mosaic needs ${v.grid.rows * v.grid.cols} frames; ${frames.length} chosen.`);
        setError(null);
        try {
          onDone(
            await upload.send(
              frames.map((f) => f.file),
              asFields(v),
              onAccepted,
            ),
          );
        } catch (err) {
          setError((err as Error).message);
          upload.reset();
        }
      })}
    >
      <FrameList
        frames={frames}
        onChange={setFrames}
        progress={s.phase === "sending" ? s.frames : s.phase === "idle" ? null : frames.map(() => 1)}
        disabled={busy}
      />
      <p className={`text-xs ${frames.length === need ? "text-ok-400" : "text-ink-400"}`} role="status">
        {frames.length} of {need || "?"} frames chosen
      </p>
      <fieldset disabled={busy} className="flex flex-col gap-3 disabled:opacity-70">
        <div className="flex gap-4">
          <div className="grid flex-1 grid-cols-2 gap-3">
            <TextField id="mosaic-rows" label="Rows" inputMode="numeric" error={e.grid?.rows?.message} {...register("grid.rows")} />
            <TextField id="mosaic-cols" label="Columns" inputMode="numeric" error={e.grid?.cols?.message} {...register("grid.cols")} />
            <div className="col-span-2 flex flex-col gap-1">
              <label htmlFor="mosaic-order" className="text-xs font-medium text-ink-300">
                Capture order
              </label>
              <select id="mosaic-order" className={SELECT} {...register("grid.order")}>
                <option value="serpentine">Serpentine (rows alternate direction)</option>
                <option value="rows">Rows (each row left to right)</option>
              </select>
            </div>
            <TextField
              id="mosaic-overlap"
              className="col-span-2"
              label="Nominal overlap (%)"
              inputMode="decimal"
              hint={`Between ${OVERLAP_RANGE.min} and ${OVERLAP_RANGE.max} % of a frame`}
              error={e.grid?.overlapPercent?.message}
              {...register("grid.overlapPercent")}
            />
          </div>
          <CapturePathDiagram rows={rows} cols={cols} order={order} />
        </div>
        <TextField id="mosaic-label" label="Label" hint="e.g. 50x bright field, whole die" error={e.capture?.label?.message} {...register("capture.label")} />
        <div className="grid grid-cols-2 gap-3">
          <div className="flex flex-col gap-1">
            <label htmlFor="mosaic-illumination" className="text-xs font-medium text-ink-300">
              Illumination
            </label>
            <select id="mosaic-illumination" className={SELECT} {...register("capture.illumination")}>
              {ILLUMINATIONS.map((i) => (
                <option key={i} value={i}>
                  {ILLUMINATION_LABELS[i]}
                </option>
              ))}
            </select>
          </div>
          <TextField
            id="mosaic-scale"
            label="Scale (µm per pixel)"
            inputMode="decimal"
            hint="Or calibrate later"
            error={e.capture?.scaleUmPerPx?.message}
            {...register("capture.scaleUmPerPx")}
          />
        </div>
        <label className="flex items-center gap-2 text-sm text-ink-200">
          <input type="checkbox" {...register("grid.flatField")} className="accent-kerf-500" />
          Correct uneven illumination (flat field from the frames&apos; median)
        </label>
      </fieldset>
      {s.phase === "sending" && (
        <div className="flex flex-col gap-1" role="status" aria-live="polite">
          <span className="text-xs text-ink-300">
            Sending frames… {(s.loaded / 1024 ** 2).toFixed(1)} / {(s.total / 1024 ** 2).toFixed(1)} MB
          </span>
          <progress aria-label="Upload progress" max={s.total} value={s.loaded} className="h-2 w-full accent-kerf-500" />
        </div>
      )}
      {(s.phase === "stitching" || s.phase === "done") && <MosaicStageSteps m={s.micrograph} />}
      <FormMessage message={error} />
      <div className="flex justify-end gap-2">
        <Button
          onClick={() => {
            upload.cancel();
            onCancel();
          }}
        >
          {s.phase === "stitching" ? "Close (stitching goes on)" : "Cancel"}
        </Button>
        <Button type="submit" variant="primary" disabled={busy || frames.length === 0}>
          {busy ? (s.phase === "stitching" ? "Stitching…" : "Uploading…") : "Upload mosaic"}
        </Button>
      </div>
    </form>
  );
}
