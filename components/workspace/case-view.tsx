"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { ColumnDef } from "@tanstack/react-table";
import type { CaseDto } from "@/lib/dto/cases";
import type { DieDto } from "@/lib/dto/dies";
import { apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { Dialog } from "@/components/ui/dialog";
import { ReviewBadge } from "@/components/ui/review-badge";
import { CaseForm } from "./case-form";
import { DieForm } from "./die-form";
import { CustodySection } from "./custody-section";
import { SampleRecordSection } from "./sample-record-section";

function Detail({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs uppercase tracking-wide text-ink-400">{label}</dt>
      <dd className="text-sm text-ink-100">{value || "—"}</dd>
    </div>
  );
}

/** A case's details and its dies; edit and delete for those whose role allows it. */
export function CaseView({ initial }: { initial: CaseDto }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [dialog, setDialog] = useState<null | "edit" | "delete" | "new-die">(null);
  const c = useQuery({ queryKey: queryKeys.case(initial.id), queryFn: () => apiFetch<CaseDto>(`/api/cases/${initial.id}`), initialData: initial }).data;
  const dies = useQuery({ queryKey: queryKeys.dies(initial.id), queryFn: () => apiFetch<DieDto[]>(`/api/cases/${initial.id}/dies`) });
  const editable = can(c.yourRole, "edit");
  const update = useMutation({
    mutationFn: (body: unknown) => apiFetch<CaseDto>(`/api/cases/${c.id}`, { method: "PATCH", body }),
    onSuccess: (data) => qc.setQueryData(queryKeys.case(c.id), data),
  });
  const createDie = useMutation({
    mutationFn: (body: unknown) => apiFetch<DieDto>(`/api/cases/${c.id}/dies`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.dies(c.id) }),
  });
  const columns = useMemo<ColumnDef<DieDto, unknown>[]>(
    () => [
      {
        accessorKey: "name",
        header: "Die",
        cell: (x) => (
          <Link href={`/dies/${x.row.original.id}`} className="font-medium text-kerf-300 hover:underline">
            {x.row.original.name}
          </Link>
        ),
      },
      {
        id: "size",
        header: "Size (µm)",
        accessorFn: (d) => (d.widthUm && d.heightUm ? `${d.widthUm} × ${d.heightUm}` : "not known"),
      },
      { accessorKey: "analystName", header: "Analyst" },
      { accessorKey: "reviewStatus", header: "Review", cell: (x) => <ReviewBadge status={x.row.original.reviewStatus} /> },
    ],
    [],
  );
  return (
    <div className="flex flex-col gap-6">
      <nav aria-label="Breadcrumb" className="text-sm text-ink-400">
        <Link href="/cases" className="hover:text-ink-200">
          Cases
        </Link>{" "}
        / <span className="text-ink-200">{c.title}</span>
      </nav>
      <section className="rounded-lg border border-ink-800 bg-ink-900 p-5">
        <div className="mb-4 flex items-start justify-between gap-4">
          <div>
            <h1 className="text-xl font-semibold">{c.title}</h1>
            <p className="text-sm text-ink-400">{c.teamName}</p>
          </div>
          {editable && (
            <div className="flex gap-2">
              <Button onClick={() => setDialog("edit")}>Edit case</Button>
              <Button variant="danger" onClick={() => setDialog("delete")}>
                Delete case
              </Button>
            </div>
          )}
        </div>
        <dl className="grid grid-cols-2 gap-4 md:grid-cols-3">
          <Detail label="Part marking" value={c.partMarking} />
          <Detail label="Package" value={c.package} />
          <Detail label="Sample id" value={c.sampleId} />
        </dl>
        {c.notes && <p className="mt-4 whitespace-pre-wrap text-sm text-ink-200">{c.notes}</p>}
      </section>
      <section className="flex flex-col gap-3">
        <div className="flex items-center justify-between">
          <h2 className="text-lg font-semibold">Dies</h2>
          {editable && (
            <Button variant="primary" onClick={() => setDialog("new-die")}>
              New die
            </Button>
          )}
        </div>
        {dies.isPending && <p className="text-sm text-ink-400">Loading dies…</p>}
        {dies.isError && (
          <p role="alert" className="text-sm text-danger-400">
            {dies.error.message}
          </p>
        )}
        {dies.data && (
          <DataTable
            data={dies.data}
            columns={columns}
            filterLabel="Filter dies"
            empty={editable ? "No dies yet. Add the first with “New die”." : "No dies in this case yet."}
          />
        )}
      </section>
      <SampleRecordSection caseId={c.id} editable={editable} />
      <CustodySection caseId={c.id} editable={editable} />
      <Dialog open={dialog === "edit"} onClose={() => setDialog(null)} title="Edit case">
        <CaseForm
          initial={c}
          submitLabel="Save"
          onCancel={() => setDialog(null)}
          onSubmit={async (values) => {
            await update.mutateAsync(values);
            setDialog(null);
          }}
        />
      </Dialog>
      <Dialog open={dialog === "new-die"} onClose={() => setDialog(null)} title="New die">
        <DieForm
          submitLabel="Add die"
          onCancel={() => setDialog(null)}
          onSubmit={async (values) => {
            await createDie.mutateAsync(values);
            setDialog(null);
          }}
        />
      </Dialog>
      <ConfirmDialog
        open={dialog === "delete"}
        title="Delete this case?"
        message={`“${c.title}” and its ${c.dieCount} die(s), with their micrographs and markup, will be deleted. This cannot be undone.`}
        confirmLabel="Delete case"
        onClose={() => setDialog(null)}
        onConfirm={async () => {
          await apiFetch(`/api/cases/${c.id}`, { method: "DELETE" });
          await qc.invalidateQueries({ queryKey: queryKeys.cases() });
          router.push("/cases");
        }}
      />
    </div>
  );
}
