"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import type { InboxItemDto } from "@/lib/dto/inbox";
import { useInbox } from "./inbox-link";
import { queryKeys } from "@/lib/client/query-keys";

const KIND_LABELS: Record<InboxItemDto["kind"], string> = {
  mention: "Mention",
  comment: "Reply",
  review_submitted: "Sent to checker",
  review_decision: "Check result",
};

/** Where an item leads: the exact remark on the die bench, or the die for check events. */
function inboxHref(item: InboxItemDto): string {
  return item.threadId ? `/dies/${item.dieId}?thread=${item.threadId}` : `/dies/${item.dieId}`;
}

/** The caller's inbox: newest first, unread ones marked; opening one marks it read. */
export function InboxView({ initial }: { initial: InboxItemDto[] }) {
  const inbox = useInbox(initial);
  const queryClient = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const items = inbox.data ?? initial;

  const markRead = async (item: InboxItemDto) => {
    if (item.readAt) return;
    try {
      const read = await apiFetch<InboxItemDto>(`/api/me/inbox/${item.id}/read`, { method: "POST" });
      queryClient.setQueryData<InboxItemDto[]>(queryKeys.inbox(), (old) => old?.map((i) => (i.id === read.id ? read : i)));
      setError(null);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    }
  };

  return (
    <section aria-label="Inbox" className="flex max-w-3xl flex-col gap-3">
      <h1 className="text-xl font-semibold">Inbox</h1>
      <p className="text-sm text-ink-300">Mentions, replies on your remarks and check events, for you alone. Mail settings do not change what arrives here.</p>
      {error && (
        <p role="alert" className="text-sm text-danger-400">
          {error}
        </p>
      )}
      {items.length === 0 && <p className="text-sm text-ink-400">Nothing here yet.</p>}
      <ul className="flex flex-col gap-1.5">
        {items.map((item) => (
          <li
            key={item.id}
            data-testid="inbox-item"
            data-unread={item.readAt ? undefined : "true"}
            className={`flex items-start gap-3 rounded-md border p-3 ${item.readAt ? "border-ink-800" : "border-kerf-500/60 bg-ink-900"}`}
          >
            <span aria-hidden className={`mt-1.5 size-2 shrink-0 rounded-full ${item.readAt ? "bg-transparent" : "bg-kerf-400"}`} />
            <div className="min-w-0 flex-1">
              <p className="text-xs text-ink-400">
                {KIND_LABELS[item.kind] ?? item.kind} · <time dateTime={item.createdAt}>{new Date(item.createdAt).toLocaleString()}</time>
                {!item.readAt && <span className="sr-only"> · unread</span>}
              </p>
              <a
                href={inboxHref(item)}
                onClick={async (e) => {
                  e.preventDefault();
                  await markRead(item);
                  // A full page load, exactly as the mailed link opens it (the bench reads ?thread= on load).
                  window.location.assign(inboxHref(item));
                }}
                className="block break-words text-sm text-ink-100 hover:text-kerf-300 hover:underline"
              >
                {item.text}
              </a>
            </div>
            {!item.readAt && (
              <button type="button" onClick={() => markRead(item)} className="shrink-0 rounded px-2 py-1 text-xs text-ink-300 hover:bg-ink-800">
                Mark read
              </button>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
