import type { DieLayout } from "./layout-types";

/**
 * Date codes printed in top metal on the two demo dies of the same part: die A carries the
 * layout's own code, die B a later lot's. Only the text changes, so everything else the
 * renderer draws (and every ground-truth position) stays the same.
 */
export const DIE_B_DATE_CODE = "2451";

/** The layout with its date-code text mark reading `code` (year and week, YYWW). */
export function withDateCode(layout: DieLayout, code: string): DieLayout {
  if (!/^\d{4}$/.test(code)) throw new RangeError(`a date code is four digits (YYWW), not "${code}"`);
  return Object.freeze({ ...layout, textMarks: layout.textMarks.map((m) => (m.kind === "date_code" ? { ...m, text: code } : m)) });
}
