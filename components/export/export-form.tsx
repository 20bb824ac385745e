"use client";

import { useState } from "react";
import { useForm, useWatch, type FieldErrors, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { ExportDto } from "@/lib/dto/exports";
import type { ViewerApi } from "@/components/viewer";
import { Button } from "@/components/ui/button";
import { MARKUP_KINDS, type MarkupKind } from "@/lib/markup/types";
import { KIND_STYLE } from "@/lib/markup/palette";
import { viewBoxUm } from "@/lib/geometry/view-box";
import type { DieRegion } from "@/lib/export/render-plan";
import { exportRequestSchema, type ExportRequest } from "@/lib/validation/exports";
import { ExportPreview } from "./export-preview";

type RegionMode = "view" | "die" | "typed";

/** What the form holds; `requestBody` turns it into the request the shared schema checks. */
type FormValues = {
  /** "" until the user picks one: the form then follows the viewer's micrograph. */
  micrographId: string;
  mode: RegionMode;
  region: DieRegion;
  sizeBy: "width" | "scale";
  widthPx: number;
  umPerPx: number;
  kinds: MarkupKind[];
  labels: boolean;
  threads: boolean;
};

const REGION_LABEL: Record<RegionMode, string> = { view: "Current view", die: "Whole die", typed: "Rectangle (µm)" };
const FIELD_NAME: Record<string, string> = {
  micrographId: "Micrograph",
  region: "Region",
  widthPx: "Output width",
  umPerPx: "Output scale",
  kinds: "Markup shown",
};

/** The die rectangle the viewer shows now, or null when the micrograph is not open in it. */
function currentViewRegion(api: ViewerApi | null, m: MicrographDto | undefined): DieRegion | null {
  if (!api || !m?.transform) return null;
  const el = api.viewer.element;
  const b = viewBoxUm({ width: el.clientWidth, height: el.clientHeight }, api.screenToImage, m.transform);
  return { x: b.minX, y: b.minY, width: b.maxX - b.minX, height: b.maxY - b.minY };
}

const round = (r: DieRegion) => ({ x: +r.x.toFixed(2), y: +r.y.toFixed(2), width: +r.width.toFixed(2), height: +r.height.toFixed(2) });

/** An empty number field is sent as 0, so the schema names what is wrong with it. */
const asNumber = { setValueAs: (v: unknown) => (v === "" || v === null || v === undefined ? 0 : Number(v)) };

/** The first message of each field the schema refused, named as the form names it. */
function errorText(errors: FieldErrors<FormValues>): string {
  if (errors.root?.message) return errors.root.message;
  const parts: string[] = [];
  const walk = (e: unknown, top: string) => {
    if (!e || typeof e !== "object") return;
    const m = (e as { message?: unknown }).message;
    if (typeof m === "string") parts.push(`${FIELD_NAME[top] ?? top}: ${m}`);
    else for (const v of Object.values(e)) walk(v, top);
  };
  for (const [k, v] of Object.entries(errors)) walk(v, k);
  return parts.join("; ");
}

/** The annotated PNG form: which micrograph, region and size, what markup, with a live preview. */
export function ExportForm({
  die,
  usable,
  api,
  shownId,
  onStarted,
}: {
  die: DieDto;
  usable: readonly MicrographDto[];
  api: ViewerApi | null;
  shownId?: string;
  onStarted: (e: ExportDto) => void;
}) {
  const qc = useQueryClient();
  const [error, setError] = useState("");
  const [viewRead, setViewRead] = useState(0);

  /** The request body the values describe (the current view is read when asked). */
  const requestBody = (v: FormValues) => {
    const micrographId = effectiveId(v.micrographId);
    const region =
      v.mode === "view"
        ? currentViewRegion(
            api,
            usable.find((m) => m.id === micrographId),
          )
        : v.mode === "typed"
          ? v.region
          : null;
    if (v.mode === "view" && !region) throw new Error("Open the micrograph in the viewer to export the current view.");
    return {
      micrographId,
      ...(region ? { region: round(region) } : {}),
      ...(v.sizeBy === "width" ? { widthPx: v.widthPx } : { umPerPx: v.umPerPx }),
      kinds: v.kinds,
      labels: v.labels,
      threads: v.threads,
    };
  };
  const schemaResolver = zodResolver(exportRequestSchema);
  // The shared schema checks the request the form describes, not the form's own fields.
  const resolver: Resolver<FormValues, unknown, ExportRequest> = async (values, context, options) => {
    let body: ReturnType<typeof requestBody>;
    try {
      body = requestBody(values);
    } catch (e) {
      return { values: {}, errors: { root: { type: "view", message: (e as Error).message } } };
    }
    // Its paths (region.x, widthPx, …) are the form's own names, so errors land on the fields.
    const result = await schemaResolver(body, context, { criteriaMode: options.criteriaMode, fields: {}, shouldUseNativeValidation: false });
    return result as Awaited<ReturnType<Resolver<FormValues, unknown, ExportRequest>>>;
  };
  const { register, handleSubmit, control, setValue, formState } = useForm<FormValues, unknown, ExportRequest>({
    resolver,
    defaultValues: {
      micrographId: "",
      mode: "die",
      region: { x: 0, y: 0, width: die.widthUm ?? 1000, height: die.heightUm ?? 1000 },
      sizeBy: "width",
      widthPx: 2048,
      umPerPx: 1,
      kinds: [...MARKUP_KINDS],
      labels: true,
      threads: false,
    },
  });
  const values = useWatch({ control }) as FormValues;
  // The list may arrive after the first render: until the user picks, follow the viewer's micrograph.
  function effectiveId(picked: string) {
    if (usable.some((m) => m.id === picked)) return picked;
    return shownId && usable.some((m) => m.id === shownId) ? shownId : (usable[0]?.id ?? "");
  }
  const micrographId = effectiveId(values.micrographId);
  // Redrawn when any field changes; the current view is re-read by "Refresh preview".
  const formKey = JSON.stringify([micrographId, values, viewRead]);

  const start = useMutation({
    mutationFn: (body: ExportRequest) => apiFetch<ExportDto>(`/api/dies/${die.id}/exports`, { method: "POST", body }),
    onSuccess: (e) => {
      setError("");
      onStarted(e);
      void qc.invalidateQueries({ queryKey: ["exports", die.id] });
    },
    onError: (e) => setError(e.message),
  });

  const field = "w-full rounded border border-ink-700 bg-ink-900 px-2 py-1 text-sm text-ink-100";
  return (
    <form noValidate className="space-y-2" onSubmit={handleSubmit((body) => start.mutate(body))}>
      <label className="block text-xs">
        Micrograph
        <select className={field} value={micrographId} onChange={(e) => setValue("micrographId", e.target.value)}>
          {usable.map((m) => (
            <option key={m.id} value={m.id}>
              {m.label}
            </option>
          ))}
        </select>
      </label>
      <fieldset className="text-xs">
        <legend>Region</legend>
        {(["view", "die", "typed"] as const).map((r) => (
          <label key={r} className="mr-3">
            <input type="radio" value={r} {...register("mode")} /> {REGION_LABEL[r]}
          </label>
        ))}
      </fieldset>
      {values.mode === "typed" && (
        <div className="grid grid-cols-4 gap-1 text-xs">
          {(["x", "y", "width", "height"] as const).map((k) => (
            <label key={k}>
              {k}
              <input aria-label={`Region ${k} (µm)`} className={field} type="number" {...register(`region.${k}`, asNumber)} />
            </label>
          ))}
        </div>
      )}
      <div className="flex items-end gap-2 text-xs">
        <label>
          <input type="radio" value="width" {...register("sizeBy")} /> Width (px)
          <input
            aria-label="Output width (px)"
            className={field}
            type="number"
            min={16}
            max={16384}
            disabled={values.sizeBy !== "width"}
            {...register("widthPx", asNumber)}
          />
        </label>
        <label>
          <input type="radio" value="scale" {...register("sizeBy")} /> Scale (µm/px)
          <input
            aria-label="Output scale (µm per pixel)"
            className={field}
            type="number"
            step="any"
            disabled={values.sizeBy !== "scale"}
            {...register("umPerPx", asNumber)}
          />
        </label>
      </div>
      <fieldset className="flex flex-wrap gap-x-3 text-xs">
        <legend>Markup shown</legend>
        {MARKUP_KINDS.map((k) => (
          <label key={k}>
            <input type="checkbox" value={k} {...register("kinds")} /> <span style={{ color: KIND_STYLE[k].colour }}>■</span> {KIND_STYLE[k].label}
          </label>
        ))}
      </fieldset>
      <div className="flex gap-3 text-xs">
        <label>
          <input type="checkbox" {...register("labels")} /> Labels
        </label>
        <label>
          <input type="checkbox" {...register("threads")} /> Review threads
        </label>
      </div>
      <ExportPreview dieId={die.id} formKey={formKey} body={() => requestBody(values)} onRefresh={() => setViewRead((n) => n + 1)} />
      <Button type="submit" variant="primary" disabled={start.isPending}>
        Render PNG
      </Button>
      <p role="status" aria-live="polite" className="text-xs text-red-300">
        {error || errorText(formState.errors)}
      </p>
    </form>
  );
}
