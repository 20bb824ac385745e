// OWASP "CSV Injection": a cell starting with = + - @ tab or CR can be read by spreadsheet
// programs as a formula. Such text cells get a leading single quote and are always quoted.
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * A text cell: neutralised as OWASP's CSV injection guidance says when it could start a
 * formula, then RFC 4180 §2 rules 5–7 (quote a field holding a comma, quote, CR or LF; double
 * inner quotes). Numbers never pass here (`csvNumber`), so negative values stay numbers.
 */
export function csvField(text: string): string {
  if (FORMULA_START.test(text)) return `"'${text.replace(/"/g, '""')}"`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Fixed decimals with trailing zeros trimmed; −0 written as 0. */
function csvNumber(value: number, decimals: number): string {
  if (Number.isInteger(value)) return Object.is(value, -0) ? "0" : String(value);
  const text = value.toFixed(decimals).replace(/(\.\d*?)0+$/, "$1").replace(/\.$/, "");
  return text === "-0" ? "0" : text;
}

/** One CSV cell: empty for null, numbers rounded to `decimals`, text quoted when needed. */
export function csvCell(value: string | number | null, decimals: number): string {
  if (value === null) return "";
  return typeof value === "number" ? csvNumber(value, decimals) : csvField(value);
}

/** Records joined with CRLF, each line ended by CRLF (RFC 4180 §2 rules 1–2). */
export function csvLines(lines: readonly string[]): string {
  return lines.map((line) => `${line}\r\n`).join("");
}
