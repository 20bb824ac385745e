"use client";

import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { ExportDto } from "@/lib/dto/exports";
import type { ViewerApi } from "@/components/viewer";
import { ExportForm } from "./export-form";
import { ExportStatus } from "./export-status";
import { RecentExports, TableDownloads } from "./export-downloads";
import { ImportGeojson } from "./import-geojson";
import { queryKeys } from "@/lib/client/query-keys";

/** The Export tab: annotated PNG form with progress, recent exports, table downloads, GeoJSON import. */
export function ExportPanel({ die, micrographs, api, shownId }: { die: DieDto; micrographs: MicrographDto[]; api: ViewerApi | null; shownId?: string }) {
  const usable = micrographs.filter((m) => m.transform && m.status !== "failed");
  const [activeId, setActiveId] = useState<string | null>(null);
  const list = useQuery({
    queryKey: queryKeys.exports(die.id),
    queryFn: () => apiFetch<ExportDto[]>(`/api/dies/${die.id}/exports`),
    refetchInterval: (q) => (q.state.data?.some((e) => e.status === "queued" || e.status === "running") ? 700 : false),
  });
  const active = list.data?.find((e) => e.id === activeId);

  return (
    <div className="space-y-5 text-sm text-ink-200">
      <section aria-label="Annotated image" className="space-y-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-400">Annotated image (PNG)</h3>
        {usable.length === 0 ? (
          <p className="text-xs text-ink-400">No micrograph is in the die frame yet: set a scale or align one first.</p>
        ) : (
          <ExportForm die={die} usable={usable} api={api} shownId={shownId} onStarted={(e) => setActiveId(e.id)} />
        )}
        {active && <ExportStatus e={active} />}
      </section>
      <TableDownloads dieId={die.id} />
      <RecentExports list={list.data ?? []} />
      {(die.yourRole === "owner" || die.yourRole === "analyst") && <ImportGeojson dieId={die.id} />}
    </div>
  );
}
