import type { PadRow, PadTable } from "./types";
import { csvRecords } from "../markup/csv";

export type PadTableCsvOptions = {
  /** Decimal places for µm values (default 3: 1 nm, far below optical resolution). */
  readonly decimals?: number;
};

const COLUMNS: readonly { header: string; value: (r: PadRow) => string | number | null }[] = [
  { header: "number", value: (r) => r.number },
  { header: "id", value: (r) => r.id },
  { header: "label", value: (r) => r.label },
  { header: "net", value: (r) => r.net },
  { header: "state", value: (r) => r.state },
  { header: "side", value: (r) => r.side },
  { header: "x_um", value: (r) => r.xUm },
  { header: "y_um", value: (r) => r.yUm },
  { header: "x_from_centre_um", value: (r) => r.xFromCentreUm },
  { header: "y_from_centre_um", value: (r) => r.yFromCentreUm },
  { header: "width_um", value: (r) => r.widthUm },
  { header: "height_um", value: (r) => r.heightUm },
  { header: "pitch_um", value: (r) => r.pitchUm },
];

/**
 * The pad table as CSV (RFC 4180): a header row, one record per pad in pad-number order,
 * CRLF line ends, an empty pitch for the last pad on a side.
 */
export function padTableCsv(table: PadTable, options: PadTableCsvOptions = {}): string {
  const decimals = options.decimals ?? 3;
  return csvRecords([COLUMNS.map((c) => c.header), ...table.rows.map((row) => COLUMNS.map((c) => c.value(row)))], decimals);
}
