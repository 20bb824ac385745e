"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { ColumnDef } from "@tanstack/react-table";
import type { CaseDto } from "@/lib/dto/cases";
import { apiFetch } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { Dialog } from "@/components/ui/dialog";
import { CaseForm } from "./case-form";

/** The cases of all the caller's teams, with a "new case" dialog for those who may create. */
export function CasesView({ editableTeams }: { editableTeams: { id: string; name: string }[] }) {
  const qc = useQueryClient();
  const router = useRouter();
  const [creating, setCreating] = useState(false);
  const [teamId, setTeamId] = useState(editableTeams[0]?.id ?? "");
  const cases = useQuery({ queryKey: queryKeys.cases(), queryFn: () => apiFetch<CaseDto[]>("/api/cases") });
  const create = useMutation({
    mutationFn: (body: unknown) => apiFetch<CaseDto>(`/api/teams/${teamId}/cases`, { method: "POST", body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.cases() }),
  });
  const columns = useMemo<ColumnDef<CaseDto, unknown>[]>(
    () => [
      {
        accessorKey: "title",
        header: "Title",
        cell: (c) => (
          <Link href={`/cases/${c.row.original.id}`} className="font-medium text-kerf-300 hover:underline">
            {c.row.original.title}
          </Link>
        ),
      },
      { accessorKey: "partMarking", header: "Part marking" },
      { accessorKey: "package", header: "Package" },
      { accessorKey: "sampleId", header: "Sample id" },
      { accessorKey: "teamName", header: "Team" },
      { accessorKey: "dieCount", header: "Dies" },
      { accessorKey: "createdAt", header: "Created", cell: (c) => new Date(c.getValue() as string).toLocaleDateString() },
    ],
    [],
  );
  return (
    <section className="flex flex-col gap-4">
      <div className="flex items-center justify-between">
        <h1 className="text-xl font-semibold">Cases</h1>
        {editableTeams.length > 0 && (
          <Button variant="primary" onClick={() => setCreating(true)}>
            New case
          </Button>
        )}
      </div>
      {cases.isPending && <p className="text-sm text-ink-400">Loading cases…</p>}
      {cases.isError && (
        <p role="alert" className="text-sm text-danger-400">
          {cases.error.message}
        </p>
      )}
      {cases.data && (
        <DataTable
          data={cases.data}
          columns={columns}
          filterLabel="Filter cases"
          initialSort={[{ id: "createdAt", desc: true }]}
          empty={editableTeams.length > 0 ? "No cases yet. Start one with “New case”." : "No cases in your teams yet."}
        />
      )}
      <Dialog open={creating} onClose={() => setCreating(false)} title="New case">
        <CaseForm
          submitLabel="Create case"
          onCancel={() => setCreating(false)}
          onSubmit={async (values) => {
            const made = await create.mutateAsync(values);
            setCreating(false);
            // Straight into the new case: adding its first die is the next step.
            router.push(`/cases/${made.id}`);
          }}
        >
          {editableTeams.length > 1 && (
            <label className="flex flex-col gap-1 text-xs font-medium text-ink-300">
              Team
              <select
                value={teamId}
                onChange={(e) => setTeamId(e.target.value)}
                className="rounded-md border border-ink-700 bg-ink-900 px-2 py-1.5 text-sm text-ink-100"
              >
                {editableTeams.map((t) => (
                  <option key={t.id} value={t.id}>
                    {t.name}
                  </option>
                ))}
              </select>
            </label>
          )}
        </CaseForm>
      </Dialog>
    </section>
  );
}
