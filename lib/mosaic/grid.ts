/**
 * The capture path of a mosaic: which grid cell each frame of the upload shows. Frames arrive
 * in capture order; "rows" scans every row left to right, rows top to bottom; "serpentine"
 * (the stage's back-and-forth path, which saves the return move) runs odd rows right to left.
 */

export type CaptureOrder = "rows" | "serpentine";

export type GridCell = { index: number; row: number; col: number };

/** The grid cell of every frame, listed in capture order (`index` = position in the upload). */
export function captureGrid(rows: number, cols: number, order: CaptureOrder): GridCell[] {
  if (!Number.isSafeInteger(rows) || !Number.isSafeInteger(cols) || rows < 1 || cols < 1) {
    throw new RangeError("rows and cols must be positive integers");
  }
  const cells: GridCell[] = [];
  for (let row = 0; row < rows; row++) {
    for (let step = 0; step < cols; step++) {
      const col = order === "serpentine" && row % 2 === 1 ? cols - 1 - step : step;
      cells.push({ index: cells.length, row, col });
    }
  }
  return cells;
}
