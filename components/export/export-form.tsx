"use client";

import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { ExportDto } from "@/lib/dto/exports";
import type { ExportRequest } from "@/lib/validation/exports";
import type { ViewerApi } from "@/components/viewer";
import { Button } from "@/components/ui/button";
import { ExportPreview } from "./export-preview";
import { FIELD_CLASS, MarkupFields, RegionFields, SizeFields } from "./export-fields";
import { exportErrorText, exportedMicrograph, exportFormDefaults, exportRequestBody, exportResolver, type ExportFormValues } from "./export-request";
import { queryKeys } from "@/lib/client/query-keys";

type Props = { die: DieDto; usable: readonly MicrographDto[]; api: ViewerApi | null; shownId?: string; onStarted: (e: ExportDto) => void };

/** The annotated PNG form: which micrograph, region and size, what markup, with a live preview. */
export function ExportForm({ die, usable, api, shownId, onStarted }: Props) {
  const qc = useQueryClient();
  const [error, setError] = useState("");
  const [viewRead, setViewRead] = useState(0);
  const body = (v: ExportFormValues) => exportRequestBody(v, exportedMicrograph(v.micrographId, usable, shownId), api);
  const { register, handleSubmit, control, setValue, formState } = useForm<ExportFormValues, unknown, ExportRequest>({
    resolver: exportResolver(body),
    defaultValues: exportFormDefaults(die),
  });
  const values = useWatch({ control }) as ExportFormValues;
  const micrographId = exportedMicrograph(values.micrographId, usable, shownId)?.id ?? "";
  // Redrawn when any field changes; the current view is re-read by "Refresh preview".
  const formKey = JSON.stringify([micrographId, values, viewRead]);

  const start = useMutation({
    mutationFn: (request: ExportRequest) => apiFetch<ExportDto>(`/api/dies/${die.id}/exports`, { method: "POST", body: request }),
    onSuccess: (e) => {
      setError("");
      onStarted(e);
      void qc.invalidateQueries({ queryKey: queryKeys.exports(die.id) });
    },
    onError: (e) => setError(e.message),
  });

  return (
    <form noValidate className="space-y-2" onSubmit={handleSubmit((request) => start.mutate(request))}>
      <label className="block text-xs">
        Micrograph
        <select className={FIELD_CLASS} value={micrographId} onChange={(e) => setValue("micrographId", e.target.value)}>
          {usable.map((m) => (
            <option key={m.id} value={m.id}>
              {m.label}
            </option>
          ))}
        </select>
      </label>
      <RegionFields register={register} mode={values.mode} />
      <SizeFields register={register} sizeBy={values.sizeBy} />
      <MarkupFields register={register} />
      <ExportPreview dieId={die.id} formKey={formKey} body={() => body(values)} onRefresh={() => setViewRead((n) => n + 1)} />
      <Button type="submit" variant="primary" disabled={start.isPending}>
        Render PNG
      </Button>
      <p role="status" aria-live="polite" className="text-xs text-red-300">
        {error || exportErrorText(formState.errors)}
      </p>
    </form>
  );
}
