"use client";

import { flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { useState } from "react";

/**
 * A sortable, filterable table with an empty state, on TanStack Table. `scrollable` (for narrow
 * places such as the side panel): cells keep to one line and the table scrolls sideways, its
 * first column staying in view.
 */
export function DataTable<T>({
  data,
  columns,
  filterLabel,
  empty,
  initialSort = [],
  scrollable = false,
}: {
  data: T[];
  columns: ColumnDef<T, unknown>[];
  filterLabel: string;
  empty: React.ReactNode;
  initialSort?: SortingState;
  scrollable?: boolean;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort);
  const [filter, setFilter] = useState("");
  // TanStack Table v8 hands back functions the React Compiler cannot memoise; it skips this
  // component, which is what the library expects.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const rows = table.getRowModel().rows;
  // The first column sticks on an opaque background so scrolled cells pass beneath it.
  const sticky = (i: number) => (scrollable && i === 0 ? " sticky left-0 z-10 bg-ink-900 shadow-[1px_0_0_var(--color-ink-800)]" : "");
  const cell = scrollable ? " whitespace-nowrap" : "";
  return (
    <div className="flex flex-col gap-2">
      <input
        type="search"
        aria-label={filterLabel}
        placeholder={filterLabel}
        value={filter}
        onChange={(e) => setFilter(e.target.value)}
        className="w-64 rounded-md border border-ink-700 bg-ink-900 px-2.5 py-1.5 text-sm placeholder:text-ink-400 focus:border-kerf-500 focus:outline-none"
      />
      <div className="overflow-x-auto rounded-lg border border-ink-800" data-testid={scrollable ? "scrolling-table" : undefined}>
        <table className={`${scrollable ? "min-w-full" : "w-full"} text-left text-sm`}>
          <thead className="bg-ink-900 text-xs uppercase tracking-wide text-ink-400">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h, i) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
                      className={`px-3 py-2 font-medium${cell}${sticky(i)}`}
                    >
                      {h.column.getCanSort() ? (
                        <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:text-ink-100">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-t border-ink-800 hover:bg-ink-900/60">
                {r.getVisibleCells().map((c, i) => (
                  <td key={c.id} className={`px-3 py-2 align-top${cell}${sticky(i)}`}>
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {rows.length === 0 && <div className="px-3 py-8 text-center text-sm text-ink-400">{filter ? "Nothing matches the filter." : empty}</div>}
      </div>
    </div>
  );
}
