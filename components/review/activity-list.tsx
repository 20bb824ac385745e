"use client";

import { useInfiniteQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import type { ActivityItem } from "@/lib/dto/activity";

const WORDS: Record<string, string> = {
  "die.created": "created the die",
  "die.updated": "changed the die",
  "markup.created": "drew",
  "markup.updated": "changed",
  "markup.deleted": "deleted",
  "thread.created": "started a thread",
  "thread.resolved": "resolved a thread",
  "thread.reopened": "reopened a thread",
  "comment.created": "commented",
  "comment.edited": "edited a comment",
  "comment.deleted": "deleted a comment",
  "review.send": "sent the die to the checker",
  "review.withdraw": "withdrew the die from the checker",
  "review.sign_off": "signed off the die",
  "review.return": "returned the die with remarks",
  "revision.opened": "opened a new revision",
};

/** The die's activity from the audit trail, newest first, a page at a time. */
export function ActivityList({ dieId }: { dieId: string }) {
  const q = useInfiniteQuery({
    queryKey: queryKeys.activity(dieId),
    queryFn: ({ pageParam }) =>
      apiFetch<{ items: ActivityItem[]; nextBefore: string | null }>(
        `/api/dies/${dieId}/activity?limit=20${pageParam ? `&before=${encodeURIComponent(pageParam)}` : ""}`,
      ),
    initialPageParam: "",
    getNextPageParam: (last) => last.nextBefore ?? undefined,
  });
  const items = q.data?.pages.flatMap((p) => p.items) ?? [];
  return (
    <section aria-label="Activity" className="flex flex-col gap-2">
      <h2 className="text-sm font-semibold">Activity</h2>
      <ol className="flex flex-col gap-1 text-xs text-ink-300">
        {items.map((i) => (
          <li key={i.id}>
            <span className="text-ink-100">{i.actorName ?? "Someone"}</span> {WORDS[i.action] ?? i.action}{" "}
            {i.detail && <span className="text-ink-400">{i.action.startsWith("markup.") ? `a ${i.detail}` : `“${i.detail}”`}</span>}
            <span className="block text-ink-500">{new Date(i.at).toLocaleString()}</span>
          </li>
        ))}
      </ol>
      {q.hasNextPage && (
        <Button variant="ghost" disabled={q.isFetchingNextPage} onClick={() => q.fetchNextPage()}>
          Show older
        </Button>
      )}
    </section>
  );
}
