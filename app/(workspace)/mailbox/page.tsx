import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { loadPage } from "@/server/http/page";
import { requireOwnedTeams } from "@/server/access/owned-teams";
import { listTeamOutbox } from "@/server/access/outbox";
import { ForbiddenError } from "@/lib/errors";
import { isLocalMailMode } from "@/server/mail/local-mail";
import { mailboxFor } from "@/server/mail/mailbox";
import { MailboxView } from "@/components/review/mailbox-view";

export const metadata: Metadata = { title: "Mailbox" };

/** What the local fake mail server received, for team owners (local mail mode only). */
export default async function MailboxPage() {
  const data = await loadPage(async ({ db, actor }) => {
    if (!isLocalMailMode()) return null;
    const teamIds = await requireOwnedTeams(db, actor).catch((e) => {
      if (e instanceof ForbiddenError) return null;
      throw e;
    });
    if (!teamIds) return { forbidden: true as const };
    const outbox = (await Promise.all(teamIds.map((t) => listTeamOutbox(db, actor, t)))).flat();
    return { forbidden: false as const, messages: mailboxFor(teamIds), problems: outbox.filter((o) => o.status !== "sent" && o.attempts > 0) };
  });
  if (!data) notFound();
  if (data.forbidden) return <p className="text-sm text-ink-300">Only a team owner can read the mailbox.</p>;
  return <MailboxView messages={data.messages} problems={data.problems} />;
}
