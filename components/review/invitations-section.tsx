"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import { ROLES, ROLE_LABELS, type TeamRole } from "@/lib/auth/permissions";
import { Button } from "@/components/ui/button";
import type { InvitationDto } from "@/lib/dto/invitations";
import type { OutboxItemDto } from "@/lib/dto/outbox";

/** The owner's invitations: invite by e-mail with a role, see and revoke pending ones, see undelivered mail. */
export function InvitationsSection({ teamId }: { teamId: string }) {
  const qc = useQueryClient();
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<TeamRole>("reviewer");
  const [message, setMessage] = useState<string | null>(null);
  const key = queryKeys.invitations(teamId);
  const pending = useQuery({ queryKey: key, queryFn: () => apiFetch<InvitationDto[]>(`/api/teams/${teamId}/invitations`) });
  const outbox = useQuery({
    queryKey: queryKeys.outbox(teamId),
    queryFn: () => apiFetch<OutboxItemDto[]>(`/api/teams/${teamId}/outbox`),
    refetchInterval: 10_000,
  });
  const invite = useMutation({
    mutationFn: () => apiFetch<InvitationDto>(`/api/teams/${teamId}/invitations`, { method: "POST", body: { email, role } }),
    onSuccess: (inv) => {
      setMessage(`Invitation sent to ${inv.email}.`);
      setEmail("");
      void qc.invalidateQueries({ queryKey: key });
    },
    onError: (e: Error) => setMessage(e.message),
  });
  const revoke = useMutation({
    mutationFn: (id: string) => apiFetch(`/api/teams/${teamId}/invitations/${id}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: key }),
  });
  const undelivered = (outbox.data ?? []).filter((o) => o.status !== "sent" && o.attempts > 0);
  return (
    <section aria-label="Invitations" className="flex flex-col gap-3">
      <h2 className="text-base font-semibold">Invite someone</h2>
      <form
        className="flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          invite.mutate();
        }}
      >
        <label className="text-sm text-ink-200">
          E-mail
          <input
            type="email"
            required
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            className="ml-2 rounded-md border border-ink-700 bg-ink-950 px-2 py-1 text-sm"
          />
        </label>
        <label className="text-sm text-ink-200">
          Role
          <select
            value={role}
            onChange={(e) => setRole(e.target.value as TeamRole)}
            className="ml-2 rounded-md border border-ink-700 bg-ink-950 px-2 py-1 text-sm"
          >
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </label>
        <Button type="submit" variant="primary" disabled={invite.isPending}>
          Send invitation
        </Button>
      </form>
      <p aria-live="polite" className="text-sm text-ink-300">
        {message}
      </p>
      <h3 className="text-sm font-semibold">Pending invitations</h3>
      <ul className="flex flex-col gap-1 text-sm">
        {(pending.data ?? []).length === 0 && <li className="text-ink-400">None.</li>}
        {(pending.data ?? []).map((inv) => (
          <li key={inv.id} className="flex items-center gap-3">
            <span className="text-ink-100">{inv.email}</span>
            <span className="text-ink-400">
              {ROLE_LABELS[inv.role]} · until {new Date(inv.expiresAt).toLocaleDateString()}
            </span>
            <Button variant="ghost" onClick={() => revoke.mutate(inv.id)}>
              Revoke
            </Button>
          </li>
        ))}
      </ul>
      {undelivered.length > 0 && (
        <div role="status" className="rounded-md border border-danger-500/50 p-2 text-xs text-ink-300">
          <p className="font-semibold text-danger-400">Mail not delivered</p>
          {undelivered.map((o) => (
            <p key={o.id}>
              {o.subject} → {o.toEmail}: {o.status === "failed" ? "gave up" : "retrying"} after {o.attempts} attempt(s) — {o.lastError}
            </p>
          ))}
        </div>
      )}
    </section>
  );
}
