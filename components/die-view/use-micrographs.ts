"use client";

import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { apiFetch } from "@/lib/client/api";

/** A die's micrographs, polled every second while any of them is still being tiled (or a mosaic stitched again). */
export function useMicrographs(dieId: string) {
  return useQuery({
    queryKey: queryKeys.micrographs(dieId),
    queryFn: () => apiFetch<MicrographDto[]>(`/api/dies/${dieId}/micrographs`),
    refetchInterval: (q) => (q.state.data?.some((m) => m.status === "queued" || m.status === "tiling" || m.mosaic?.restitching) ? 1000 : false),
  });
}
