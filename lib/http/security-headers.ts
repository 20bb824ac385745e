/**
 * Response headers that keep pages from being framed, sniffed or leaking their addresses.
 * Pure: the proxy adds the page policy with a fresh nonce per request, next.config.ts adds the
 * fixed ones to everything it serves (API, tiles, static files).
 */

/** Headers for every response (OWASP Secure Headers Project recommendations). */
export const COMMON_SECURITY_HEADERS: Readonly<Record<string, string>> = {
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=()",
  "X-Frame-Options": "DENY",
};

/** API answers are data, never documents: nothing may run or load from them, nor frame them. */
export const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/**
 * The page policy. Scripts: our own files plus the inline ones Next.js writes for the RSC
 * payload, which carry the per-request nonce ('strict-dynamic' lets those load the chunks).
 * Styles may be inline because React renders `style` attributes. Images: blob: and data: for
 * the viewer's canvases and the export preview. Development adds 'unsafe-eval' (React's
 * dev tools need it); production never does.
 */
export function pageContentSecurityPolicy(nonce: string, dev = false): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** A nonce of 128 random bits, base64 (CSP Level 3 §2.3.1 asks for at least 128 bits). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
