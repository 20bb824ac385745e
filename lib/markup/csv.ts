import { stringify, type Options } from "csv-stringify/sync";

// OWASP "CSV Injection": a cell starting with = + - @ tab or CR can be read by spreadsheet
// programs as a formula. Such text cells get a leading single quote and are always quoted.
const FORMULA_START = /^[=+\-@\t\r]/;

/** A cell value before writing: text, a number (rounded), or null for an empty cell. */
type CsvValue = string | number | null;

/** Fixed decimals with trailing zeros trimmed; −0 written as 0. */
function csvNumber(value: number, decimals: number): string {
  if (Number.isInteger(value)) return Object.is(value, -0) ? "0" : String(value);
  const text = value
    .toFixed(decimals)
    .replace(/(\.\d*?)0+$/, "$1")
    .replace(/\.$/, "");
  return text === "-0" ? "0" : text;
}

/**
 * csv-stringify options: RFC 4180 quoting (§2 rules 5–7) is the library's; our cast rounds
 * numbers and neutralises formula-like text (OWASP). Numbers never pass the text cast, so a
 * negative value stays a number.
 */
function options(decimals: number, eof: boolean): Options {
  return {
    record_delimiter: "\r\n", // RFC 4180 §2 rules 1–2: CRLF after every record
    // RFC 4180 §2 rule 6: a field holding a lone LF or CR is quoted too (csv-stringify stops
    // doing so by default once record_delimiter is set).
    quote_record_delimiter: true,
    eof,
    cast: {
      number: (value) => csvNumber(value, decimals),
      string: (value) => (FORMULA_START.test(value) ? { value: `'${value}`, quoted: true } : value),
    },
  };
}

/** Records as RFC 4180 CSV: each record ended by CRLF, null cells empty. */
export function csvRecords(records: readonly (readonly CsvValue[])[], decimals: number): string {
  return stringify(
    records.map((r) => [...r]),
    options(decimals, true),
  );
}

/** One text cell as it appears in a record (neutralised, quoted when needed). */
export function csvField(text: string): string {
  return stringify([[text]], options(0, false));
}
