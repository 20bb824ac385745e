"use client";

import { captureGrid, type CaptureOrder } from "@/lib/mosaic/grid";

/**
 * A small diagram of the capture path: the grid's cells numbered in the order the frames are
 * expected (1 = the first file), with the stage's path drawn through their centres.
 */
export function CapturePathDiagram({ rows, cols, order }: { rows: number; cols: number; order: CaptureOrder }) {
  if (!Number.isInteger(rows) || !Number.isInteger(cols) || rows < 1 || cols < 1 || rows > 50 || cols > 50) return null;
  const cell = Math.max(8, Math.min(44, Math.floor(260 / Math.max(rows, cols))));
  const cells = captureGrid(rows, cols, order);
  const centre = (r: number, c: number) => [c * cell + cell / 2 + 1, r * cell + cell / 2 + 1] as const;
  const path = cells.map((g) => centre(g.row, g.col).join(",")).join(" ");
  const numbers = cell >= 18;
  return (
    <svg
      role="img"
      aria-label={`Capture path: ${rows} rows by ${cols} columns, ${order === "serpentine" ? "serpentine (rows alternate direction)" : "each row left to right"}, rows top to bottom`}
      width={cols * cell + 2}
      height={rows * cell + 2}
      className="shrink-0"
      data-testid="capture-path"
    >
      <defs>
        <marker id="capture-arrow" viewBox="0 0 6 6" refX="5" refY="3" markerWidth="5" markerHeight="5" orient="auto-start-reverse">
          <path d="M0,0 L6,3 L0,6 z" className="fill-kerf-400" />
        </marker>
      </defs>
      {cells.map((g) => (
        <g key={g.index}>
          <rect x={g.col * cell + 1} y={g.row * cell + 1} width={cell} height={cell} className="fill-ink-900 stroke-ink-600" strokeWidth={1} />
          {numbers && (
            <text x={g.col * cell + 4} y={g.row * cell + 12} className="fill-ink-400 text-[9px]">
              {g.index + 1}
            </text>
          )}
        </g>
      ))}
      <polyline points={path} fill="none" className="stroke-kerf-400" strokeWidth={1.5} markerEnd="url(#capture-arrow)" />
      <circle cx={centre(cells[0].row, cells[0].col)[0]} cy={centre(cells[0].row, cells[0].col)[1]} r={3} className="fill-kerf-400" />
    </svg>
  );
}
