"use client";

import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/query-keys";
import type { CustodyEventDto } from "@/lib/dto/sample";
import { CUSTODY_ACTIONS } from "@/lib/dto/stored-values";
import { CUSTODY_ACTION_LABELS } from "@/lib/sample/labels";
import { custodyEntrySchema, type CustodyEntryInput, type CustodyEntryOutput } from "@/lib/validation/sample";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

/** The append-only chain of custody: who held the sample, where, and when (server time). */
export function CustodySection({ caseId, editable }: { caseId: string; editable: boolean }) {
  const log = useQuery({ queryKey: queryKeys.custody(caseId), queryFn: () => apiFetch<CustodyEventDto[]>(`/api/cases/${caseId}/custody`) });
  return (
    <section aria-labelledby="custody-heading" className="flex flex-col gap-3 rounded-lg border border-ink-800 bg-ink-900 p-5">
      <div>
        <h2 id="custody-heading" className="text-lg font-semibold">
          Chain of custody
        </h2>
        <p className="text-sm text-ink-400">Entries are never changed or removed; a correction is a new entry. Times are recorded by the server.</p>
      </div>
      {log.isPending && <p className="text-sm text-ink-400">Loading the chain of custody…</p>}
      {log.isError && (
        <p role="alert" className="text-sm text-danger-400">
          {log.error.message}
        </p>
      )}
      {log.data && (
        <div className="overflow-x-auto rounded-lg border border-ink-800">
          <table className="w-full text-left text-sm" aria-labelledby="custody-heading">
            <thead className="bg-ink-900 text-xs uppercase tracking-wide text-ink-400">
              <tr>
                {["When", "Who", "Action", "To", "Location", "Note"].map((h) => (
                  <th key={h} scope="col" className="px-3 py-2 font-medium">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {log.data.map((e) => (
                <tr key={e.id} className="border-t border-ink-800">
                  <td className="whitespace-nowrap px-3 py-2 align-top">
                    <time dateTime={e.at}>{when(e.at)}</time>
                  </td>
                  <td className="px-3 py-2 align-top">{e.actorName}</td>
                  <td className="px-3 py-2 align-top">{CUSTODY_ACTION_LABELS[e.action]}</td>
                  <td className="px-3 py-2 align-top">{e.to || "—"}</td>
                  <td className="px-3 py-2 align-top">{e.location || "—"}</td>
                  <td className="px-3 py-2 align-top whitespace-pre-wrap">{e.note || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {log.data.length === 0 && <div className="px-3 py-6 text-center text-sm text-ink-400">No custody entries yet.</div>}
        </div>
      )}
      {editable && <CustodyEntryForm caseId={caseId} />}
    </section>
  );
}

const BLANK: CustodyEntryInput = { action: "received", to: "", location: "", note: "" };

function CustodyEntryForm({ caseId }: { caseId: string }) {
  const qc = useQueryClient();
  const form = useForm<CustodyEntryInput, unknown, CustodyEntryOutput>({ resolver: zodResolver(custodyEntrySchema), defaultValues: BLANK });
  const add = useMutation({
    mutationFn: (body: CustodyEntryOutput) => apiFetch<CustodyEventDto>(`/api/cases/${caseId}/custody`, { method: "POST", body }),
    onSuccess: (entry) => {
      qc.setQueryData<CustodyEventDto[]>(queryKeys.custody(caseId), (old) => [...(old ?? []), entry]);
      form.reset(BLANK);
    },
  });
  const e = form.formState.errors;
  return (
    <form noValidate aria-label="Add a custody entry" className="flex flex-col gap-2" onSubmit={form.handleSubmit((v) => add.mutate(v))}>
      <h3 className="text-sm font-semibold text-ink-100">Add an entry</h3>
      <div className="grid gap-2 md:grid-cols-[10rem_1fr_1fr]">
        <div className="flex flex-col gap-1">
          <label htmlFor="custody-action" className="text-xs font-medium text-ink-300">
            Action
          </label>
          <select
            id="custody-action"
            {...form.register("action")}
            className="w-full rounded-md border border-ink-700 bg-ink-900 px-2.5 py-1.5 text-sm text-ink-100 focus:border-kerf-500 focus:outline-none"
          >
            {CUSTODY_ACTIONS.map((a) => (
              <option key={a} value={a}>
                {CUSTODY_ACTION_LABELS[a]}
              </option>
            ))}
          </select>
        </div>
        <TextField id="custody-to" label="To (person or place)" error={e.to?.message} {...form.register("to")} />
        <TextField id="custody-location" label="Location" error={e.location?.message} {...form.register("location")} />
      </div>
      <TextField id="custody-note" label="Note" error={e.note?.message} {...form.register("note")} />
      <div className="flex items-center justify-end gap-3">
        <div className="flex-1">
          <FormMessage message={add.isError ? add.error.message : null} />
        </div>
        <Button type="submit" variant="primary" disabled={add.isPending}>
          {add.isPending ? "Adding…" : "Add custody entry"}
        </Button>
      </div>
    </form>
  );
}
