"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { apiFetch } from "@/lib/client/api";
import type { ThreadDto } from "@/lib/dto/threads";

/** The die's threads: the one owner of `queryKeys.threads`, read by the review panel and by the markup's review states. */
export function useThreadList(dieId: string) {
  return useQuery({ queryKey: queryKeys.threads(dieId), queryFn: () => apiFetch<ThreadDto[]>(`/api/dies/${dieId}/threads`) });
}

/** The die's threads and the mutations on them; every change refreshes the list. */
export function useThreads(dieId: string) {
  const qc = useQueryClient();
  const threads = useThreadList(dieId);
  const refresh = () => {
    void qc.invalidateQueries({ queryKey: queryKeys.threads(dieId) });
    void qc.invalidateQueries({ queryKey: queryKeys.activity(dieId) });
  };
  const start = useMutation({
    mutationFn: (body: { shapeId: string; body: string } | { region: unknown; body: string }) =>
      apiFetch<ThreadDto>(`/api/dies/${dieId}/threads`, { method: "POST", body }),
    onSuccess: refresh,
  });
  const reply = useMutation({
    mutationFn: (p: { threadId: string; body: string }) => apiFetch(`/api/threads/${p.threadId}/comments`, { method: "POST", body: { body: p.body } }),
    onSuccess: refresh,
  });
  const setStatus = useMutation({
    mutationFn: (p: { threadId: string; resolve: boolean }) => apiFetch(`/api/threads/${p.threadId}/${p.resolve ? "resolve" : "reopen"}`, { method: "POST" }),
    onSuccess: refresh,
  });
  const edit = useMutation({
    mutationFn: (p: { commentId: string; body: string }) => apiFetch(`/api/comments/${p.commentId}`, { method: "PATCH", body: { body: p.body } }),
    onSuccess: refresh,
  });
  const remove = useMutation({ mutationFn: (commentId: string) => apiFetch(`/api/comments/${commentId}`, { method: "DELETE" }), onSuccess: refresh });
  return { threads, start, reply, setStatus, edit, remove };
}

export type ThreadsApi = ReturnType<typeof useThreads>;
