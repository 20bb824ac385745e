"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import type { ThreadDto } from "@/lib/dto/threads";
import type { MemberDto } from "@/lib/dto/teams";
import { CommentBody } from "./comment-body";
import { ReplyBox } from "./reply-box";
import type { ThreadsApi } from "./use-threads";

const when = (iso: string) => new Date(iso).toLocaleString();

/** One remark: its text and replies (own ones editable), a reply box, close / reopen. */
export function ThreadView({
  thread,
  number,
  members,
  userId,
  canComment,
  api,
  onBack,
}: {
  thread: ThreadDto;
  number: number;
  members: readonly MemberDto[];
  userId: string;
  canComment: boolean;
  api: ThreadsApi;
  onBack: () => void;
}) {
  const [editing, setEditing] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const names = members.flatMap((m) => [m.name, m.email]);
  // "resolved" is the stored status; people read it as a closed remark.
  const closed = thread.status === "resolved";
  const toggle = () => api.setStatus.mutateAsync({ threadId: thread.id, resolve: !closed }).catch((e: Error) => setError(e.message));
  return (
    <section aria-label={`Remark ${number}`} className="flex flex-col gap-3">
      <div className="flex items-center justify-between">
        <Button variant="ghost" onClick={onBack}>
          ← All remarks
        </Button>
        <span className={`text-xs ${closed ? "text-ink-300" : "text-kerf-300"}`}>{closed ? "Closed" : "Open"}</span>
      </div>
      <h3 className="text-sm font-semibold">
        Remark {number} {thread.shapeId ? "on a shape" : "on a region"}
        {thread.orphaned && <span className="ml-2 rounded bg-ink-800 px-1.5 py-0.5 text-xs text-ink-300">shape deleted</span>}
      </h3>
      {closed && thread.resolvedBy && (
        <p className="text-xs text-ink-300">
          Closed by {thread.resolvedBy.name} on {when(thread.resolvedAt!)}
        </p>
      )}
      <ol aria-label="Remark and replies" className="flex flex-col gap-3">
        {thread.comments.map((c, i) => (
          <li key={c.id} className="rounded-md border border-ink-800 bg-ink-950/60 p-2">
            <p className="mb-1 text-xs text-ink-400">
              <span className="font-medium text-ink-200">{c.authorName ?? "Former member"}</span> · {when(c.createdAt)}
              {c.editedAt && " · edited"}
            </p>
            {editing === c.id ? (
              <ReplyBox
                members={members}
                label={i === 0 ? "Edit the remark" : "Edit the reply"}
                submitLabel="Save"
                initial={c.body}
                onCancel={() => setEditing(null)}
                onSubmit={async (body) => {
                  await api.edit.mutateAsync({ commentId: c.id, body });
                  setEditing(null);
                }}
              />
            ) : (
              <CommentBody body={c.body} names={names} />
            )}
            {c.authorId === userId && canComment && editing !== c.id && (
              <div className="mt-1 flex gap-2 text-xs">
                <button className="text-ink-400 hover:text-ink-200" onClick={() => setEditing(c.id)}>
                  Edit
                </button>
                <button className="text-ink-400 hover:text-danger-400" onClick={() => api.remove.mutateAsync(c.id).catch((e: Error) => setError(e.message))}>
                  Delete
                </button>
              </div>
            )}
          </li>
        ))}
      </ol>
      {error && (
        <p role="alert" className="text-xs text-danger-400">
          {error}
        </p>
      )}
      {canComment && (
        <>
          <ReplyBox members={members} label="Reply" submitLabel="Reply" onSubmit={(body) => api.reply.mutateAsync({ threadId: thread.id, body })} />
          <Button onClick={toggle}>{closed ? "Reopen remark" : "Close remark"}</Button>
        </>
      )}
    </section>
  );
}
