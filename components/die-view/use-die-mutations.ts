"use client";

import { useRouter } from "next/navigation";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DieDto } from "@/lib/dto/dies";
import { apiFetch } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/query-keys";

/** Changes the die's name, size and notes; the answer replaces the cached die, so header and panel show it at once. */
export function useUpdateDie(dieId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: unknown) => apiFetch<DieDto>(`/api/dies/${dieId}`, { method: "PATCH", body }),
    onSuccess: (d) => qc.setQueryData(queryKeys.die(dieId), d),
  });
}

/** Deletes the die with its micrographs and markup, refreshes the case's lists and goes back to the case. */
export function useDeleteDie(die: Pick<DieDto, "id" | "caseId">) {
  const qc = useQueryClient();
  const router = useRouter();
  return useMutation({
    mutationFn: () => apiFetch(`/api/dies/${die.id}`, { method: "DELETE" }),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: queryKeys.dies(die.caseId) });
      await qc.invalidateQueries({ queryKey: queryKeys.cases() });
      router.push(`/cases/${die.caseId}`);
    },
  });
}
