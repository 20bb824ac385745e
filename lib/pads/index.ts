export { buildPadTable } from "./build-pad-table";
export { PadTableInputError } from "./pad-table-input-error";
export { padTableCsv } from "./pad-table-csv";
export type { PadInput, PadTable } from "./types";
