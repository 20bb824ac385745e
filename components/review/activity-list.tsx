"use client";

import { useInfiniteQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import type { ActivityItem } from "@/lib/dto/activity";
import { activitySentence } from "@/lib/review/activity-words";

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
            <span className="text-ink-100">{i.actorName ?? "Someone"}</span> {activitySentence(i.action, i.detail)}
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
