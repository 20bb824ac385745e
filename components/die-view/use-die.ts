"use client";

import { useQuery } from "@tanstack/react-query";
import type { DieDto } from "@/lib/dto/dies";
import { apiFetch } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/query-keys";

/** The die as the client knows it, starting from what the server rendered; the header and the workspace read the same entry. */
export function useDie(initial: DieDto): DieDto {
  return useQuery({ queryKey: queryKeys.die(initial.id), queryFn: () => apiFetch<DieDto>(`/api/dies/${initial.id}`), initialData: initial }).data;
}
