export { buildPadTable } from "./build-pad-table";
export { dieFrameFromOutline, toOutlineAxes, type DieFrame } from "./die-frame";
export { PadTableInputError } from "./pad-table-input-error";
export { padTableCsv, type PadTableCsvOptions } from "./pad-table-csv";
export type { PadInput, PadRow, PadSide, PadState, PadTable, PadTableOptions } from "./types";
