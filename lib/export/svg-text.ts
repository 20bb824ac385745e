/** Escapes text for SVG/XML character data and attribute values (XML 1.0 §2.4, §3.3.3). */
export function xmlEscape(text: string): string {
  return (
    text
      // Control characters other than tab, LF and CR are not allowed in XML 1.0 (§2.2).
      .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/g, "")
      .replace(/&/g, "&amp;")
      .replace(/</g, "&lt;")
      .replace(/>/g, "&gt;")
      .replace(/"/g, "&quot;")
      .replace(/'/g, "&apos;")
  );
}

/** A number as SVG writes it: at most 2 decimals, no exponent. */
export const n2 = (v: number): string => (Math.round(v * 100) / 100).toString();

/** Shortens text to at most `max` characters, ending with an ellipsis when cut. */
export function clip(text: string, max: number): string {
  const oneLine = text.replace(/\s+/g, " ").trim();
  return oneLine.length <= max ? oneLine : `${oneLine.slice(0, max - 1)}…`;
}
