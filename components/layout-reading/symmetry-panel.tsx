"use client";

import { useMemo } from "react";
import type { ColumnDef } from "@tanstack/react-table";
import type { AnyShape } from "@/lib/markup/types";
import { shapeLabel } from "@/lib/markup/markup-table";
import type { SymmetryPair } from "@/lib/symmetry";
import { deviationColour } from "@/lib/layout-reading/symmetry-view";
import { DataTable } from "@/components/ui/data-table";
import { KIND_STYLE } from "@/components/annotate/palette";
import { DeviationChart } from "./deviation-chart";
import { NumberInput, SelectInput } from "./fields";
import type { SymmetryView } from "./use-symmetry-view";

type PairRow = {
  id: string;
  kind: SymmetryPair["kind"];
  aId: string;
  bId: string;
  a: string;
  b: string;
  deviationUm: number;
  dxUm: number;
  dyUm: number;
  sizeUm: number;
  sizeText: string;
  ok: boolean;
};

const f2 = (v: number) => v.toFixed(2);

function toRow(p: SymmetryPair, labels: ReadonlyMap<string, string>): PairRow {
  const size = p.sizeDifferenceUm;
  const sizeText = "lengthUm" in size ? `Δl ${f2(size.lengthUm)}` : `Δw ${f2(size.widthUm)}, Δh ${f2(size.heightUm)}`;
  const sizeUm = "lengthUm" in size ? Math.abs(size.lengthUm) : Math.max(Math.abs(size.widthUm), Math.abs(size.heightUm));
  return {
    id: `${p.aId}:${p.bId}`,
    kind: p.kind,
    aId: p.aId,
    bId: p.bId,
    a: labels.get(p.aId) ?? "",
    b: p.selfPaired ? "(itself)" : (labels.get(p.bId) ?? ""),
    deviationUm: p.deviationUm,
    dxUm: p.offsetUm.x,
    dyUm: p.offsetUm.y,
    sizeUm,
    sizeText,
    ok: p.withinTolerance,
  };
}

function Controls({ view }: { view: SymmetryView }) {
  return (
    <div className="grid grid-cols-2 gap-2">
      {view.axes.length > 1 && (
        <div className="col-span-2">
          <SelectInput
            id="symmetry-axis"
            label="Axis"
            value={view.axisShape?.id ?? ""}
            onChange={view.setAxisId}
            options={view.axes.map((a, i) => [a.id, shapeLabel(a) || `Axis ${i + 1}`] as const)}
          />
        </div>
      )}
      <NumberInput id="symmetry-tolerance" label="Tolerance" unit="µm" value={view.tolerance} onChange={view.setTolerance} />
      <NumberInput id="symmetry-radius" label="Largest pairing distance" unit="µm" value={view.radius} onChange={view.setRadius} />
      <label className="col-span-2 flex items-center gap-2 text-xs text-ink-300">
        <input type="checkbox" checked={view.showGhosts} onChange={(e) => view.setShowGhosts(e.target.checked)} className="accent-kerf-500" /> Show mirror
        ghosts on the canvas
      </label>
    </div>
  );
}

/**
 * The symmetry report of the die about its marked axis: each pad, block and trace with its
 * mirror partner and deviation (sortable), the shapes left without one, and a histogram.
 */
export function SymmetryPanel({ view, shapes, onPick }: { view: SymmetryView; shapes: readonly AnyShape[]; onPick: (id: string) => void }) {
  const labels = useMemo(() => new Map(shapes.map((s) => [s.id, shapeLabel(s) || KIND_STYLE[s.kind].label])), [shapes]);
  // Shapes on the axis are their own mirror image: listed apart, not as pairs.
  const rows = useMemo(() => (view.report?.pairs ?? []).filter((p) => !p.selfPaired).map((p) => toRow(p, labels)), [view.report, labels]);
  const onAxis = useMemo(() => (view.report?.pairs ?? []).filter((p) => p.selfPaired), [view.report]);
  const columns = useMemo<ColumnDef<PairRow, unknown>[]>(
    () => [
      {
        accessorKey: "a",
        header: "Shape",
        cell: (c) => (
          <button
            type="button"
            className="text-left hover:underline"
            title={KIND_STYLE[c.row.original.kind].label}
            style={{ color: KIND_STYLE[c.row.original.kind].colour }}
            onClick={() => onPick(c.row.original.aId)}
          >
            {c.row.original.a}
          </button>
        ),
      },
      {
        accessorKey: "b",
        header: "Partner",
        cell: (c) => (
          <button type="button" className="text-left hover:underline" onClick={() => onPick(c.row.original.bId)}>
            {c.row.original.b}
          </button>
        ),
      },
      {
        accessorKey: "deviationUm",
        header: "Offset µm",
        cell: (c) => (
          <span className="inline-flex items-center gap-1 tabular-nums" title={`Δx ${f2(c.row.original.dxUm)}, Δy ${f2(c.row.original.dyUm)} µm`}>
            <span
              aria-hidden="true"
              className="inline-block h-2 w-2 rounded-full"
              style={{ background: deviationColour(c.row.original.deviationUm, view.fullScaleUm) }}
            />
            {f2(c.row.original.deviationUm)}
          </span>
        ),
      },
      {
        accessorKey: "sizeUm",
        header: "Size Δ µm",
        cell: (c) => (
          <span className="tabular-nums" title={c.row.original.sizeText}>
            {f2(c.row.original.sizeUm)}
          </span>
        ),
      },
      { accessorKey: "ok", header: "OK", cell: (c) => (c.row.original.ok ? "yes" : "no") },
    ],
    [onPick, view.fullScaleUm],
  );
  if (view.axes.length === 0)
    return <p className="text-sm text-ink-400">No symmetry axis is marked on this die. Draw one with the Symmetry axis tool, then the report appears here.</p>;
  const r = view.report;
  return (
    <section aria-label="Symmetry report" className="flex flex-col gap-3">
      <Controls view={view} />
      {view.error && (
        <p role="alert" className="text-xs text-danger-400">
          {view.error}
        </p>
      )}
      {r && (
        <>
          <p className="text-xs text-ink-300" data-testid="symmetry-summary">
            {r.summary.pairCount} pairs, {r.summary.withinToleranceCount} within tolerance · largest offset {f2(r.summary.maxDeviationUm)} µm · mean{" "}
            {f2(r.summary.meanDeviationUm)} µm · {r.summary.onAxisCount} on the axis · {r.unmatched.length} without a partner
          </p>
          <DeviationChart deviations={rows.map((p) => p.deviationUm)} toleranceUm={r.options.toleranceUm} fullScaleUm={view.fullScaleUm} />
          <DataTable
            data={rows}
            columns={columns}
            filterLabel="Filter pairs"
            empty="No pads, blocks or traces to pair."
            initialSort={[{ id: "deviationUm", desc: true }]}
            scrollable
          />
          {onAxis.length > 0 && (
            <div className="flex flex-col gap-1" data-testid="symmetry-on-axis">
              <h3 className="text-xs font-semibold text-ink-300">On the axis (their own mirror image)</h3>
              <ul className="flex flex-wrap gap-1.5 text-xs">
                {onAxis.map((p) => (
                  <li key={p.aId}>
                    <button
                      type="button"
                      onClick={() => onPick(p.aId)}
                      title={p.withinTolerance ? "Centred on the axis within tolerance" : "Off the axis by more than the tolerance"}
                      className="rounded border border-ink-700 px-1.5 py-0.5 hover:border-kerf-500"
                      style={{ color: KIND_STYLE[p.kind].colour }}
                    >
                      {labels.get(p.aId)} <span className="tabular-nums text-ink-400">{f2(p.deviationUm / 2)} µm off</span>
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          )}
          {r.unmatched.length > 0 && (
            <div className="flex flex-col gap-1">
              <h3 className="text-xs font-semibold text-ink-300">Without a partner</h3>
              <ul className="flex flex-wrap gap-1.5 text-xs">
                {r.unmatched.map((u) => (
                  <li key={u.id}>
                    <button
                      type="button"
                      onClick={() => onPick(u.id)}
                      className="rounded border border-ink-700 px-1.5 py-0.5 hover:border-kerf-500"
                      style={{ color: KIND_STYLE[u.kind].colour }}
                    >
                      {labels.get(u.id)}
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          )}
        </>
      )}
    </section>
  );
}
