import Link from "next/link";
import { Wordmark } from "@/components/ui/wordmark";
import { loadPage } from "@/server/http/page";
import { getMe } from "@/server/access/teams";
import { isLocalMailMode } from "@/server/mail/local-mail";
import { listMyInvitations } from "@/server/access/invitations";
import { unreadInboxCount } from "@/server/access/inbox";
import { InboxLink } from "@/components/account/inbox-link";
import { InvitationPrompts } from "@/components/account/invitation-prompts";

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const { me, invitations, unread } = await loadPage(async ({ db, actor }) => ({
    me: await getMe(db, actor),
    invitations: await listMyInvitations(db, actor),
    unread: await unreadInboxCount(db, actor),
  }));
  return (
    <div className="flex min-h-screen flex-col">
      <header className="flex items-center gap-6 border-b border-ink-800 bg-ink-900 px-5 py-2.5">
        <Link href="/cases" aria-label="Kerfline home">
          <Wordmark />
        </Link>
        <nav aria-label="Main" className="flex items-center gap-1 text-sm">
          <Link href="/cases" className="rounded px-2 py-1 text-ink-200 hover:bg-ink-800">
            Cases
          </Link>
          {me.teams.map((t) => (
            <Link key={t.id} href={`/teams/${t.id}`} className="rounded px-2 py-1 text-ink-300 hover:bg-ink-800">
              {t.name}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <InboxLink initialUnread={unread} />
          <Link href="/account" className="rounded px-2 py-1 text-ink-300 hover:bg-ink-800" data-testid="signed-in-as">
            {me.user.name} <span className="text-ink-400">({me.user.email})</span>
          </Link>
          {me.teams.some((t) => t.role === "owner") && isLocalMailMode() && (
            <Link href="/mailbox" className="rounded px-2 py-1 text-ink-200 hover:bg-ink-800">
              Mailbox
            </Link>
          )}
          <Link href="/settings/notifications" className="rounded px-2 py-1 text-ink-200 hover:bg-ink-800">
            Notifications
          </Link>
          <Link href="/sign-out" className="rounded px-2 py-1 text-ink-200 hover:bg-ink-800">
            Sign out
          </Link>
        </div>
      </header>
      <InvitationPrompts invitations={invitations} />
      <main className="mx-auto w-full max-w-6xl flex-1 p-6">{children}</main>
    </div>
  );
}
