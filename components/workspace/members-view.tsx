"use client";

import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { ColumnDef } from "@tanstack/react-table";
import type { MemberDto } from "@/lib/dto/teams";
import { apiFetch } from "@/lib/client/api";
import { ROLES, ROLE_LABELS, can, type TeamRole } from "@/lib/auth/permissions";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { InvitationsSection } from "@/components/review/invitations-section";

/** A team's members; the owner changes roles and removes members here. */
export function MembersView({ team, myUserId }: { team: { id: string; name: string; yourRole: TeamRole }; myUserId: string }) {
  const qc = useQueryClient();
  const manage = can(team.yourRole, "manage_team");
  const [removing, setRemoving] = useState<MemberDto | null>(null);
  const [error, setError] = useState<string | null>(null);
  const members = useQuery({ queryKey: queryKeys.members(team.id), queryFn: () => apiFetch<MemberDto[]>(`/api/teams/${team.id}/members`) });
  const changeRole = useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: TeamRole }) =>
      apiFetch<MemberDto>(`/api/teams/${team.id}/members/${userId}`, { method: "PATCH", body: { role } }),
    onMutate: () => setError(null),
    onError: (e) => setError(e.message),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.members(team.id) }),
  });
  const columns = useMemo<ColumnDef<MemberDto, unknown>[]>(
    () => [
      { accessorKey: "name", header: "Name" },
      { accessorKey: "email", header: "E-mail" },
      {
        accessorKey: "role",
        header: "Role",
        cell: (c) => {
          const m = c.row.original;
          if (!manage) return ROLE_LABELS[m.role];
          return (
            <select
              aria-label={`Role of ${m.name}`}
              value={m.role}
              onChange={(e) => changeRole.mutate({ userId: m.userId, role: e.target.value as TeamRole })}
              className="rounded border border-ink-700 bg-ink-900 px-1.5 py-0.5 text-sm"
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          );
        },
      },
      {
        id: "actions",
        header: "",
        enableSorting: false,
        cell: (c) =>
          manage && c.row.original.userId !== myUserId ? (
            <Button variant="ghost" onClick={() => setRemoving(c.row.original)}>
              Remove
            </Button>
          ) : null,
      },
    ],
    [manage, myUserId, changeRole],
  );
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1 className="text-xl font-semibold">{team.name}</h1>
        <p className="text-sm text-ink-400">Your role: {ROLE_LABELS[team.yourRole]}</p>
      </div>
      <div aria-live="polite" className="text-sm text-danger-400">
        {error}
      </div>
      {members.isPending && <p className="text-sm text-ink-400">Loading members…</p>}
      {members.data && <DataTable data={members.data} columns={columns} filterLabel="Filter members" empty="No members." />}
      {manage && <InvitationsSection teamId={team.id} />}
      <ConfirmDialog
        open={!!removing}
        title="Remove this member?"
        message={`${removing?.name ?? ""} will lose access to this team's cases.`}
        confirmLabel="Remove"
        onClose={() => setRemoving(null)}
        onConfirm={async () => {
          await apiFetch(`/api/teams/${team.id}/members/${removing!.userId}`, { method: "DELETE" });
          await qc.invalidateQueries({ queryKey: queryKeys.members(team.id) });
        }}
      />
    </section>
  );
}
