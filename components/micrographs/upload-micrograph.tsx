"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { ILLUMINATIONS, ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { useResumableUpload, type UploadState } from "./use-resumable-upload";

type Values = {
  label: string;
  illumination: (typeof ILLUMINATIONS)[number];
  objectiveMag: string;
  numericalAperture: string;
  cameraPixelPitchUm: string;
  adapterMag: string;
  scaleUmPerPx: string;
};

/** What the upload is doing, in words (a lost connection says where it will resume). */
function progressWords(s: Exclude<UploadState, { phase: "idle" }>): string {
  if (s.phase === "reconnecting") return `Connection lost — resuming from ${s.acceptedPercent} %`;
  if (s.phase === "checking") return "Checking the file…";
  return s.resumed ? "Resuming the earlier upload of this file" : "Uploading";
}

/**
 * The upload form: file plus capture data, with a byte progress bar while it streams. The file
 * goes by the resumable tus protocol: a dropped connection resumes where it stopped.
 */
export function UploadMicrograph({ dieId, onUploaded, onCancel }: { dieId: string; onUploaded: (m: MicrographDto) => void; onCancel: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [error, setError] = useState<string | null>(null);
  const upload = useResumableUpload(dieId);
  const progress = upload.state.phase === "idle" ? null : upload.state;
  const { register, handleSubmit, formState } = useForm<Values>({
    defaultValues: {
      label: "",
      illumination: "bright_field",
      objectiveMag: "",
      numericalAperture: "",
      cameraPixelPitchUm: "",
      adapterMag: "1",
      scaleUmPerPx: "",
    },
  });
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={handleSubmit(async (v) => {
        if (!file) return setError("Choose a micrograph file first.");
        setError(null);
        const fields = Object.fromEntries(Object.entries(v).filter(([, val]) => val !== ""));
        try {
          onUploaded(await upload.send(file, fields));
        } catch (e) {
          setError((e as Error).message);
        }
      })}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor="mg-file" className="text-xs font-medium text-ink-300">
          Micrograph file (JPEG, PNG, TIFF, BigTIFF, WebP)
        </label>
        <input
          id="mg-file"
          type="file"
          accept="image/jpeg,image/png,image/tiff,image/webp,.tif,.tiff"
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          className="text-sm text-ink-200 file:mr-3 file:rounded-md file:border-0 file:bg-ink-700 file:px-3 file:py-1.5 file:text-ink-100"
        />
      </div>
      <TextField id="mg-label" label="Label" hint="e.g. 10x bright field, full die" {...register("label")} />
      <div className="flex flex-col gap-1">
        <label htmlFor="mg-illumination" className="text-xs font-medium text-ink-300">
          Illumination
        </label>
        <select id="mg-illumination" {...register("illumination")} className="rounded-md border border-ink-700 bg-ink-900 px-2 py-1.5 text-sm">
          {ILLUMINATIONS.map((i) => (
            <option key={i} value={i}>
              {ILLUMINATION_LABELS[i]}
            </option>
          ))}
        </select>
      </div>
      <fieldset className="grid grid-cols-2 gap-3 rounded-md border border-ink-800 p-3">
        <legend className="px-1 text-xs text-ink-400">Capture data (scale = pixel pitch ÷ (objective × adapter))</legend>
        <TextField id="mg-objective" label="Objective magnification" inputMode="decimal" hint="e.g. 20" {...register("objectiveMag")} />
        <TextField id="mg-na" label="Numerical aperture" inputMode="decimal" hint="e.g. 0.45" {...register("numericalAperture")} />
        <TextField id="mg-pitch" label="Camera pixel pitch (µm)" inputMode="decimal" hint="e.g. 3.45" {...register("cameraPixelPitchUm")} />
        <TextField id="mg-adapter" label="Adapter magnification" inputMode="decimal" hint="e.g. 1 (none)" {...register("adapterMag")} />
        <TextField
          id="mg-scale"
          className="col-span-2"
          label="Or scale directly (µm per pixel)"
          inputMode="decimal"
          hint="Leave all empty to calibrate on the image later"
          {...register("scaleUmPerPx")}
        />
      </fieldset>
      {progress && (
        <div className="flex flex-col gap-1">
          <div className="flex justify-between text-xs text-ink-300" role="status" aria-live="polite">
            <span className={progress.phase === "reconnecting" ? "text-amber-300" : undefined}>{progressWords(progress)}</span>
            <span>
              {(progress.loaded / 1024 ** 2).toFixed(1)} / {(progress.total / 1024 ** 2).toFixed(1)} MB
            </span>
          </div>
          <progress aria-label="Upload progress" max={progress.total} value={progress.loaded} className="h-2 w-full accent-kerf-500" />
        </div>
      )}
      <FormMessage message={error} />
      <div className="flex justify-end gap-2">
        <Button
          onClick={async () => {
            await upload.cancel();
            onCancel();
          }}
        >
          Cancel
        </Button>
        <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Uploading…" : "Upload"}
        </Button>
      </div>
    </form>
  );
}
