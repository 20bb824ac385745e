/**
 * Whether a request that changes something came from one of our own pages (the Fetch
 * Metadata and Origin headers a browser adds, RFC 6454 §7 and the Fetch standard). Browsers
 * send `Origin` on every cross-origin POST — multipart and body-less ones too, which need no
 * preflight — so an `Origin` that is not ours is refused. Without `Origin`, `Sec-Fetch-Site`
 * decides: `same-site` covers a sibling origin on another port of the same host and is
 * refused like `cross-site`. A request with neither header does not come from a browser
 * page (curl, scripts), and a cookie alone cannot be forged that way.
 */
export type OriginVerdict = { ok: true } | { ok: false; reason: string };

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

const CROSS_ORIGIN_MESSAGE = "This request came from another site or port and was refused: changes are accepted only from Kerfline's own pages.";

export function checkSameOrigin(req: { method: string; origin: string | null; secFetchSite: string | null }, ownOrigins: readonly string[]): OriginVerdict {
  if (SAFE_METHODS.has(req.method.toUpperCase())) return { ok: true };
  if (req.origin !== null) {
    const origin = req.origin.trim().toLowerCase();
    if (origin !== "null" && ownOrigins.some((o) => o.toLowerCase() === origin)) return { ok: true };
    return { ok: false, reason: CROSS_ORIGIN_MESSAGE };
  }
  const site = req.secFetchSite?.trim().toLowerCase();
  if (site === undefined || site === "same-origin" || site === "none") return { ok: true };
  return { ok: false, reason: CROSS_ORIGIN_MESSAGE };
}
