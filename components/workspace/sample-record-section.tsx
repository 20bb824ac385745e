"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/query-keys";
import type { SampleRecordDto } from "@/lib/dto/sample";
import { sampleRecordSchema, type SampleRecordInput, type SampleRecordOutput } from "@/lib/validation/sample";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { InstantField } from "./instant-field";
import { PreparationSteps } from "./preparation-steps";

/** The case's sample record: how the part arrived, where it is kept, and how it was prepared. */
export function SampleRecordSection({ caseId, editable }: { caseId: string; editable: boolean }) {
  const record = useQuery({ queryKey: queryKeys.sample(caseId), queryFn: () => apiFetch<SampleRecordDto>(`/api/cases/${caseId}/sample`) });
  return (
    <section aria-labelledby="sample-record-heading" className="flex flex-col gap-3 rounded-lg border border-ink-800 bg-ink-900 p-5">
      <div>
        <h2 id="sample-record-heading" className="text-lg font-semibold">
          Sample record
        </h2>
        {!editable && <p className="text-sm text-ink-400">Read only: owners and analysts keep this record.</p>}
      </div>
      {record.isPending && <p className="text-sm text-ink-400">Loading the sample record…</p>}
      {record.isError && (
        <p role="alert" className="text-sm text-danger-400">
          {record.error.message}
        </p>
      )}
      {record.data && <SampleRecordForm caseId={caseId} record={record.data} editable={editable} />}
    </section>
  );
}

function SampleRecordForm({ caseId, record, editable }: { caseId: string; record: SampleRecordDto; editable: boolean }) {
  const qc = useQueryClient();
  const [saved, setSaved] = useState(false);
  const form = useForm<SampleRecordInput, unknown, SampleRecordOutput>({ resolver: zodResolver(sampleRecordSchema), defaultValues: record });
  const save = useMutation({
    mutationFn: (body: SampleRecordOutput) => apiFetch<SampleRecordDto>(`/api/cases/${caseId}/sample`, { method: "PUT", body }),
    onSuccess: (data) => {
      qc.setQueryData(queryKeys.sample(caseId), data);
      form.reset(data);
      setSaved(true);
    },
  });
  const { register, control, formState } = form;
  const e = formState.errors;
  return (
    <form
      noValidate
      aria-label="Sample record"
      className="flex flex-col gap-4"
      onChange={() => setSaved(false)}
      onSubmit={form.handleSubmit((values) => save.mutate(values))}
    >
      <fieldset disabled={!editable} className="flex flex-col gap-4">
        <div className="grid gap-3 md:grid-cols-3">
          <InstantField control={control} name="receivedAt" id="sample-received-at" label="Received at" error={e.receivedAt?.message} />
          <TextField id="sample-received-from" label="Received from" error={e.receivedFrom?.message} {...register("receivedFrom")} />
          <TextField id="sample-storage" label="Storage location" error={e.storageLocation?.message} {...register("storageLocation")} />
          <TextField id="sample-condition" label="Condition on receipt" className="md:col-span-3" error={e.condition?.message} {...register("condition")} />
        </div>
        <PreparationSteps control={control} register={register} errors={e} editable={editable} />
      </fieldset>
      {editable && (
        <div className="flex items-center justify-end gap-3">
          <div className="flex-1">
            <FormMessage message={save.isError ? save.error.message : null} />
          </div>
          {saved && (
            <p role="status" className="text-sm text-ok-400">
              Saved.
            </p>
          )}
          <Button type="submit" variant="primary" disabled={save.isPending}>
            {save.isPending ? "Saving…" : "Save sample record"}
          </Button>
        </div>
      )}
    </form>
  );
}
