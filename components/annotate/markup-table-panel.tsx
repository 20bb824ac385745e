"use client";

import { useMemo, useState } from "react";
import type { ColumnDef } from "@tanstack/react-table";
import { markupTableRows, type MarkupTableRow } from "@/lib/markup/markup-table";
import { MARKUP_KINDS, type AnyShape, type MarkupKind } from "@/lib/markup/types";
import { DataTable } from "@/components/ui/data-table";
import type { Editor } from "./editor/types";
import { KIND_STYLE } from "./palette";

const LABEL_KEY: Record<MarkupKind, string> = {
  pad: "label",
  wire_bond: "label",
  block: "name",
  symmetry_axis: "name",
  trace: "label",
  ruler: "label",
  note: "text",
  die_outline: "label",
};
import { formatUm } from "@/lib/units/format-um";

function RenameCell({ row, editor, canEdit }: { row: MarkupTableRow; editor: Editor; canEdit: boolean }) {
  const [value, setValue] = useState(row.label);
  if (!canEdit) return <span>{row.label}</span>;
  return (
    <input
      aria-label={`Rename ${KIND_STYLE[row.kind].label} ${row.label}`}
      value={value}
      onChange={(e) => setValue(e.target.value)}
      onBlur={() => value !== row.label && editor.updateProperties(row.id, { [LABEL_KEY[row.kind]]: value })}
      onKeyDown={(e) => e.key === "Enter" && (e.target as HTMLInputElement).blur()}
      size={Math.max(8, value.length + 2)}
      className="w-full min-w-[6rem] rounded border border-transparent bg-transparent px-1 hover:border-ink-700 focus:border-kerf-500 focus:outline-none"
    />
  );
}

/** Every shape of the die with its size, length or area; filter by kind, sort, rename in place. */
export function MarkupTablePanel({
  dieId,
  shapes,
  authors,
  editor,
  canEdit,
  onPick,
  umPerPx = null,
}: {
  dieId: string;
  shapes: readonly AnyShape[];
  authors: Record<string, string>;
  editor: Editor;
  canEdit: boolean;
  onPick: (id: string) => void;
  umPerPx?: number | null;
}) {
  const n1 = useMemo(() => (v: number | null) => (v === null ? "" : formatUm(v, umPerPx)), [umPerPx]);
  const [kind, setKind] = useState<MarkupKind | "">("");
  const rows = useMemo(() => markupTableRows(shapes, authors).filter((r) => !kind || r.kind === kind), [shapes, authors, kind]);
  const columns = useMemo<ColumnDef<MarkupTableRow, unknown>[]>(
    () => [
      {
        accessorKey: "kind",
        header: "Kind",
        cell: (c) => (
          <button
            type="button"
            onClick={() => onPick(c.row.original.id)}
            className="whitespace-nowrap hover:underline"
            style={{ color: KIND_STYLE[c.row.original.kind].colour }}
          >
            {KIND_STYLE[c.row.original.kind].label}
          </button>
        ),
      },
      {
        accessorKey: "label",
        header: "Label",
        cell: (c) => <RenameCell key={`${c.row.original.id}-${c.row.original.label}`} row={c.row.original} editor={editor} canEdit={canEdit} />,
      },
      {
        id: "size",
        header: "Size / length",
        accessorFn: (r) => r.lengthUm ?? r.areaUm2 ?? 0,
        cell: (c) =>
          c.row.original.lengthUm !== null
            ? `${n1(c.row.original.lengthUm)} µm`
            : c.row.original.areaUm2 !== null
              ? `${n1(c.row.original.widthUm)} × ${n1(c.row.original.heightUm)} µm`
              : "",
      },
      { accessorKey: "estimates", header: "Estimates", cell: (c) => <span className="whitespace-nowrap tabular-nums">{c.getValue() as string}</span> },
      { accessorKey: "author", header: "Author" },
      { accessorKey: "updatedAt", header: "Updated", cell: (c) => new Date(c.getValue() as string).toLocaleString() },
    ],
    [editor, canEdit, onPick, n1],
  );
  return (
    <section aria-label="Markup table" className="flex flex-col gap-2">
      <div className="flex items-center gap-2">
        <label htmlFor="markup-kind-filter" className="text-xs text-ink-300">
          Kind
        </label>
        <select
          id="markup-kind-filter"
          value={kind}
          onChange={(e) => setKind(e.target.value as MarkupKind | "")}
          className="rounded border border-ink-700 bg-ink-950 px-1.5 py-0.5 text-xs"
        >
          <option value="">all</option>
          {MARKUP_KINDS.map((k) => (
            <option key={k} value={k}>
              {KIND_STYLE[k].label}
            </option>
          ))}
        </select>
        <a href={`/api/dies/${dieId}/markup.csv`} className="ml-auto text-xs text-kerf-300 hover:underline">
          CSV
        </a>
      </div>
      <DataTable data={rows} columns={columns} filterLabel="Filter markup" empty="No markup yet." scrollable />
    </section>
  );
}
