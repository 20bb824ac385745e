"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import type { InboxItemDto } from "@/lib/dto/inbox";

/** Reads the caller's inbox; shared by the top bar's count and the inbox page. */
export function useInbox(initial?: InboxItemDto[]) {
  return useQuery({
    queryKey: queryKeys.inbox(),
    queryFn: () => apiFetch<{ items: InboxItemDto[] }>("/api/me/inbox").then((r) => r.items),
    initialData: initial,
    // New mentions show up without a reload; a hidden tab does not poll.
    refetchInterval: 30_000,
    refetchOnWindowFocus: true,
  });
}

/** The top bar's way into the inbox, with the number of unread items. */
export function InboxLink({ initialUnread }: { initialUnread: number }) {
  const inbox = useInbox();
  const unread = inbox.data ? inbox.data.filter((i) => !i.readAt).length : initialUnread;
  return (
    <Link
      href="/inbox"
      className="flex items-center gap-1.5 rounded px-2 py-1 text-ink-200 hover:bg-ink-800"
      aria-label={unread ? `Inbox, ${unread} unread` : "Inbox"}
      data-testid="inbox-link"
    >
      Inbox
      {unread > 0 && (
        <span data-testid="inbox-unread" className="min-w-5 rounded-full bg-kerf-500 px-1.5 text-center text-xs font-semibold leading-5 text-ink-950">
          {unread}
        </span>
      )}
    </Link>
  );
}
