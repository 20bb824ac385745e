"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { ROLE_LABELS } from "@/lib/auth/permissions";
import type { MyInvitationDto } from "@/lib/dto/invitations";

type Prompt = Pick<MyInvitationDto, "id" | "teamName" | "role"> & { inviterName: string | null };

/** One invitation an existing user is asked about: team, role, inviter; join or decline. */
export function InvitationPrompt({
  invitation,
  onAnswered,
  onDismiss,
}: {
  invitation: Prompt;
  onAnswered?: (joined: boolean) => void;
  onDismiss?: () => void;
}) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const answer = async (how: "accept" | "decline") => {
    setBusy(true);
    try {
      const r = await apiFetch<{ joined: boolean }>(`/api/me/invitations/${invitation.id}/${how}`, { method: "POST" });
      setResult(r.joined ? `You joined ${invitation.teamName}.` : `You declined the invitation to ${invitation.teamName}.`);
      setError(null);
      onAnswered?.(r.joined);
      // Joining adds a team to the page (navigation, lists); declining changes nothing on it,
      // and a refresh would replace this confirmation by the page's own state at once.
      if (r.joined) router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };
  const role = ROLE_LABELS[invitation.role].toLowerCase();
  return (
    <div
      role="region"
      aria-label={`Invitation to ${invitation.teamName}`}
      className="flex flex-wrap items-center gap-3 rounded-md border border-kerf-500/50 bg-ink-900 px-4 py-2.5 text-sm"
    >
      {result ? (
        <>
          <p role="status" className="text-ink-200">
            {result}
          </p>
          {onDismiss && (
            <Button className="ml-auto" onClick={onDismiss}>
              Dismiss
            </Button>
          )}
        </>
      ) : (
        <>
          <p className="text-ink-200">
            <strong className="text-ink-100">{invitation.inviterName ?? "A team owner"}</strong> invited you to join{" "}
            <strong className="text-ink-100">{invitation.teamName}</strong> as <strong className="text-ink-100">{role}</strong>. You join only if you accept.
          </p>
          <div className="ml-auto flex gap-2">
            <Button variant="primary" disabled={busy} onClick={() => answer("accept")}>
              Join {invitation.teamName}
            </Button>
            <Button disabled={busy} onClick={() => answer("decline")}>
              Decline
            </Button>
          </div>
        </>
      )}
      {error && (
        <p role="alert" className="w-full text-danger-400">
          {error}
        </p>
      )}
    </div>
  );
}

/**
 * Every pending invitation of the signed-in user, under the top bar. An answered one stays, with
 * its result, until dismissed: the refresh after answering drops it from the server's list, and
 * the confirmation would otherwise vanish before anyone could read it.
 */
export function InvitationPrompts({ invitations }: { invitations: MyInvitationDto[] }) {
  const [kept, setKept] = useState(invitations);
  const [dismissed, setDismissed] = useState<ReadonlySet<string>>(new Set());
  const added = invitations.filter((i) => !kept.some((k) => k.id === i.id));
  if (added.length > 0) setKept([...kept, ...added]);
  const shown = kept.filter((i) => !dismissed.has(i.id));
  if (shown.length === 0) return null;
  return (
    <div className="flex flex-col gap-2 border-b border-ink-800 px-5 py-3">
      {shown.map((i) => (
        <InvitationPrompt
          key={i.id}
          invitation={{ id: i.id, teamName: i.teamName, role: i.role, inviterName: i.invitedBy?.name ?? null }}
          onDismiss={() => setDismissed(new Set([...dismissed, i.id]))}
        />
      ))}
    </div>
  );
}
