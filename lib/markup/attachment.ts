/** A file name safe in any file system and header: ASCII letters, digits, dot, dash, underscore. */
export function safeFileName(name: string): string {
  const ascii = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[^A-Za-z0-9._-]+/g, "-")
    .replace(/-{2,}/g, "-")
    .replace(/-+\./g, ".")
    .replace(/^[-.]+|[-.]+$/g, "");
  return ascii.slice(0, 120) || "die";
}

/** RFC 8187 §3.2.1 value-chars: attr-char stays, everything else is percent-encoded UTF-8. */
function extValue(text: string): string {
  return encodeURIComponent(text).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

/**
 * A Content-Disposition header for a download (RFC 6266 §4): an ASCII `filename` for every
 * client and `filename*` in UTF-8 (RFC 8187) so the die's own name survives where supported.
 */
export function attachmentDisposition(fileName: string): string {
  return `attachment; filename="${safeFileName(fileName)}"; filename*=UTF-8''${extValue(fileName)}`;
}
