"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { apiFetch } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/query-keys";
import type { MicrographDto, MosaicPairDto } from "@/lib/dto/micrographs";
import { OVERLAP_RANGE } from "@/lib/validation/mosaics";
import { DataTable } from "@/components/ui/data-table";
import { Button } from "@/components/ui/button";
import { isWeakPair } from "./frame-outlines";

const COLUMNS: ColumnDef<MosaicPairDto, unknown>[] = [
  { id: "pair", header: "Frames", accessorFn: (p) => `${p.a + 1}–${p.b + 1}`, sortingFn: (x, y) => x.original.a - y.original.a || x.original.b - y.original.b },
  { id: "shift", header: "dx, dy (px)", accessorFn: (p) => `${p.dx.toFixed(1)}, ${p.dy.toFixed(1)}`, enableSorting: false },
  { id: "peak", header: "Peak", accessorFn: (p) => p.peak, cell: (c) => (c.getValue() as number).toFixed(3) },
  {
    id: "used",
    header: "Used",
    accessorFn: (p) => (isWeakPair(p) ? "stage model" : "measured"),
    cell: (c) => <span className={isWeakPair(c.row.original) ? "font-medium text-amber-300" : "text-ok-400"}>{c.getValue() as string}</span>,
  },
];

/** Stitch the same frames again with another overlap or order; the current result stays until the new one is ready. */
function StitchAgain({ m }: { m: MicrographDto }) {
  const qc = useQueryClient();
  const mo = m.mosaic!;
  const [overlap, setOverlap] = useState(String(mo.overlapPercent));
  const [order, setOrder] = useState(mo.order);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setError(null);
        try {
          await apiFetch(`/api/micrographs/${m.id}/mosaic/restitch`, { method: "POST", body: { overlapPercent: Number(overlap), order } });
          await qc.invalidateQueries({ queryKey: queryKeys.micrographs(m.dieId) });
        } catch (err) {
          setError((err as Error).message);
        } finally {
          setBusy(false);
        }
      }}
    >
      <label className="flex flex-col gap-1 text-xs text-ink-300">
        Overlap (%)
        <input
          type="number"
          min={OVERLAP_RANGE.min}
          max={OVERLAP_RANGE.max}
          step="any"
          value={overlap}
          onChange={(e) => setOverlap(e.target.value)}
          className="w-20 rounded-md border border-ink-700 bg-ink-900 px-2 py-1 text-sm"
        />
      </label>
      <label className="flex flex-col gap-1 text-xs text-ink-300">
        Order
        <select
          value={order}
          onChange={(e) => setOrder(e.target.value as typeof order)}
          className="rounded-md border border-ink-700 bg-ink-900 px-2 py-1 text-sm"
        >
          <option value="serpentine">Serpentine</option>
          <option value="rows">Rows</option>
        </select>
      </label>
      <Button type="submit" disabled={busy || mo.restitching || m.status !== "ready"}>
        {mo.restitching ? "Stitching again…" : "Stitch again"}
      </Button>
      {error && (
        <p role="alert" className="w-full text-xs text-danger-400">
          {error}
        </p>
      )}
    </form>
  );
}

/** The shown mosaic's registration: fit, warnings, the pair table, and stitching again. */
export function MosaicPanel({ micrograph: m, editable }: { micrograph: MicrographDto; editable: boolean }) {
  const mo = m.mosaic;
  if (!mo) return null;
  const weak = mo.pairs.filter(isWeakPair).length;
  return (
    <section aria-label="Mosaic" className="flex flex-col gap-2">
      <h2 className="text-sm font-semibold">Mosaic</h2>
      <p className="text-xs text-ink-300">
        {mo.rows} × {mo.cols} frames of {mo.frameWidth} × {mo.frameHeight} px, {mo.order === "serpentine" ? "serpentine" : "row by row"}, {mo.overlapPercent} %
        overlap
        {mo.flatField ? ", flat-field corrected" : ""}.
        {mo.residualPx && (
          <>
            {" "}
            Placement residual {mo.residualPx.rms.toFixed(2)} px RMS, {mo.residualPx.max.toFixed(2)} px max.
          </>
        )}
        {weak > 0 && <span className="text-amber-300"> {weak === 1 ? "One pair" : `${weak} pairs`} did not register and used the stage model.</span>}
      </p>
      {mo.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-xs text-amber-300">
          {mo.warnings.map((w, i) => (
            <li key={i}>{w}</li>
          ))}
        </ul>
      )}
      {mo.pairs.length > 0 && <DataTable data={mo.pairs} columns={COLUMNS} filterLabel="Filter pairs" empty="No pairs." scrollable />}
      {editable && m.status === "ready" && <StitchAgain m={m} />}
    </section>
  );
}
