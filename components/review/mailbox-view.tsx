"use client";

import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import type { MailboxEntry, StoredMessage } from "@/lib/dto/mailbox";
import type { OutboxItemDto } from "@/lib/dto/outbox";
import { CommentBody } from "./comment-body";

/** The local mailbox: messages on the left, the chosen one (text part, inert HTML part) on the right. */
export function MailboxView({ messages, problems }: { messages: MailboxEntry[]; problems: OutboxItemDto[] }) {
  const [openId, setOpenId] = useState<string | null>(null);
  const [showHtml, setShowHtml] = useState(false);
  const open = useQuery({ queryKey: queryKeys.mail(openId), queryFn: () => apiFetch<StoredMessage>(`/api/mailbox/${openId}`), enabled: !!openId });
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Mailbox</h1>
      <p className="text-sm text-ink-300">
        No mail server is configured, so Kerfline keeps the mail it sends on this machine. These are the messages for your teams.
      </p>
      {problems.length > 0 && (
        <section aria-label="Mail not delivered" className="rounded-md border border-danger-500/50 p-3">
          <h2 className="text-sm font-semibold text-danger-400">Mail not delivered yet</h2>
          <ul className="text-xs text-ink-300">
            {problems.map((p) => (
              <li key={p.id}>
                {p.subject} → {p.toEmail}: {p.status === "failed" ? "gave up" : "retrying"} after {p.attempts} attempt(s) — {p.lastError}
              </li>
            ))}
          </ul>
        </section>
      )}
      <div className="grid grid-cols-[20rem_1fr] gap-4">
        <ul aria-label="Messages" className="flex flex-col gap-1">
          {messages.length === 0 && <li className="text-sm text-ink-400">No messages yet.</li>}
          {messages.map((m) => (
            <li key={m.id}>
              <button
                onClick={() => setOpenId(m.id)}
                className={`w-full rounded-md border p-2 text-left text-sm ${openId === m.id ? "border-kerf-500 bg-ink-800" : "border-ink-800 hover:bg-ink-800"}`}
              >
                <span className="block truncate font-medium text-ink-100">{m.subject}</span>
                <span className="block truncate text-xs text-ink-400">
                  to {m.to} · {new Date(m.date).toLocaleString()}
                </span>
              </button>
            </li>
          ))}
        </ul>
        <section aria-label="Message" className="min-w-0 rounded-md border border-ink-800 p-3">
          {!openId && <p className="text-sm text-ink-400">Choose a message.</p>}
          {open.data && (
            <article className="flex flex-col gap-2">
              <h2 className="text-base font-semibold">{open.data.subject}</h2>
              <p className="text-xs text-ink-400">
                From {open.data.from} to {open.data.to}
              </p>
              {open.data.html && (
                <label className="flex items-center gap-2 text-xs text-ink-300">
                  <input type="checkbox" checked={showHtml} onChange={(e) => setShowHtml(e.target.checked)} /> Show the HTML part
                </label>
              )}
              {showHtml && open.data.html ? (
                // An empty sandbox: no scripts, no same-origin access, no navigation of this page.
                <iframe title="HTML part" sandbox="" srcDoc={open.data.html} className="h-96 w-full rounded bg-white" />
              ) : (
                <CommentBody body={open.data.text} />
              )}
            </article>
          )}
        </section>
      </div>
    </div>
  );
}
