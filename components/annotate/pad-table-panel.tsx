"use client";

import { useMemo } from "react";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { ColumnDef } from "@tanstack/react-table";
import type { PadRow, PadTable } from "@/lib/pads/types";
import { apiFetch } from "@/lib/client/api";
import { DataTable } from "@/components/ui/data-table";
import { formatUm } from "@/lib/units/format-um";
import { ProbingCaution } from "./probing-caution";

/**
 * The pad table: pads numbered counter-clockwise from pad 1 with side, centre, size and pitch;
 * a click on a row selects the pad and flies the viewer to it.
 */
export function PadTablePanel({
  dieId,
  selection,
  onPick,
  umPerPx = null,
}: {
  dieId: string;
  selection: ReadonlySet<string>;
  onPick: (padId: string) => void;
  umPerPx?: number | null;
}) {
  const num = useMemo(() => (v: number | null) => (v === null ? "—" : formatUm(v, umPerPx)), [umPerPx]);
  const pads = useQuery({
    queryKey: queryKeys.pads(dieId),
    queryFn: () => apiFetch<PadTable & { outlineSource: string }>(`/api/dies/${dieId}/pads`),
    retry: false,
  });
  const columns = useMemo<ColumnDef<PadRow, unknown>[]>(
    () => [
      { accessorKey: "number", header: "#" },
      {
        accessorKey: "label",
        header: "Label",
        cell: (c) => (
          <button
            type="button"
            onClick={() => onPick(c.row.original.id)}
            className={`text-left font-medium hover:underline ${selection.has(c.row.original.id) ? "text-kerf-300" : "text-ink-100"}`}
            aria-current={selection.has(c.row.original.id)}
          >
            {c.row.original.label || "(no label)"}
          </button>
        ),
      },
      { accessorKey: "net", header: "Net" },
      { accessorKey: "state", header: "State" },
      { accessorKey: "side", header: "Side" },
      { accessorKey: "xUm", header: "x µm", cell: (c) => num(c.getValue() as number) },
      { accessorKey: "yUm", header: "y µm", cell: (c) => num(c.getValue() as number) },
      { accessorKey: "pitchUm", header: "Pitch µm", cell: (c) => num(c.getValue() as number | null) },
    ],
    [onPick, selection, num],
  );
  if (pads.isPending) return <p className="text-sm text-ink-400">Loading the pad table…</p>;
  if (pads.isError)
    return (
      <p className="text-sm text-ink-400" role="status">
        {pads.error.message}
      </p>
    );
  const t = pads.data;
  return (
    <section aria-label="Pad table" className="flex flex-col gap-2">
      <div className="flex items-center justify-between">
        <p className="text-xs text-ink-300">
          {t.rows.length} pads · N {t.summary.padsPerSide.N} E {t.summary.padsPerSide.E} S {t.summary.padsPerSide.S} W {t.summary.padsPerSide.W} · min pitch{" "}
          {num(t.summary.minPitchUm)} µm
        </p>
        <a href={`/api/dies/${dieId}/pads.csv`} className="text-xs text-kerf-300 hover:underline">
          CSV
        </a>
      </div>
      {t.summary.probedNotBonded.length > 0 && (
        <p className="text-xs text-ink-300">Probed, not bonded: {t.summary.probedNotBonded.map((p) => p.label || `#${p.number}`).join(", ")}</p>
      )}
      {t.rows.some((r) => r.state === "probed") && <ProbingCaution />}
      {t.outsideDie.length > 0 && (
        <p role="alert" className="text-xs text-kerf-300" data-testid="pads-outside-die">
          Outside the die outline, not numbered:{" "}
          {t.outsideDie.map((p, i) => (
            <span key={p.id}>
              {i > 0 && ", "}
              <button type="button" onClick={() => onPick(p.id)} className="underline">
                {p.label || "(no label)"}
              </button>{" "}
              ({num(p.xUm)}, {num(p.yUm)} µm)
            </span>
          ))}
          . Select one and tick “Include in the pad numbering” to number it.
        </p>
      )}
      <DataTable data={[...t.rows]} columns={columns} filterLabel="Filter pads" empty="No pads marked yet. Draw them with the Pad tool (P)." scrollable />
    </section>
  );
}
