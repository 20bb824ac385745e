import "server-only";
import { env } from "../env";
import { checkSameOrigin, type OriginVerdict } from "@/lib/http/same-origin";

/**
 * The absolute origin links point at (mail, IIIF ids): KERFLINE_PUBLIC_URL when set; the
 * forwarded or Host header only when KERFLINE_TRUST_PROXY=1 (otherwise anyone could make a
 * genuine mail link to their own host by forging it); else localhost on the configured port.
 */
export function publicOrigin(req: Request): string {
  const configured = env().KERFLINE_PUBLIC_URL;
  if (configured) return new URL(configured).origin;
  if (env().KERFLINE_TRUST_PROXY) return forwardedOrigin(req);
  return `http://localhost:${env().PORT}`;
}

/** The origin as a trusted proxy reports it (X-Forwarded-*, then Host). */
function forwardedOrigin(req: Request): string {
  const url = new URL(req.url);
  const host = firstValue(req.headers.get("x-forwarded-host")) ?? req.headers.get("host") ?? url.host;
  const proto = firstValue(req.headers.get("x-forwarded-proto")) ?? url.protocol.replace(":", "");
  return `${proto}://${host}`;
}

const firstValue = (h: string | null) => h?.split(",")[0].trim() || undefined;

/** The origin the browser addressed: its Host header (a page cannot set it) on our scheme. */
function addressedOrigin(req: Request): string {
  if (env().KERFLINE_TRUST_PROXY) return forwardedOrigin(req);
  const url = new URL(req.url);
  return `${url.protocol}//${req.headers.get("host") ?? url.host}`;
}

/** Same-origin check for requests that change something (see lib/http/same-origin.ts). */
export function sameOriginVerdict(req: Request): OriginVerdict {
  return checkSameOrigin({ method: req.method, origin: req.headers.get("origin"), secFetchSite: req.headers.get("sec-fetch-site") }, [
    publicOrigin(req),
    addressedOrigin(req),
  ]);
}

/** Says once at start where links will point, so a wrong setting is seen before mail goes out. */
export function describeLinkOrigin(): string {
  const e = env();
  if (e.KERFLINE_PUBLIC_URL) return `links in mail and IIIF ids use KERFLINE_PUBLIC_URL (${new URL(e.KERFLINE_PUBLIC_URL).origin})`;
  if (e.KERFLINE_TRUST_PROXY) return "links in mail and IIIF ids follow X-Forwarded-Host/Host (KERFLINE_TRUST_PROXY=1)";
  return `KERFLINE_PUBLIC_URL is not set: links in mail and IIIF ids point at http://localhost:${e.PORT}; set it to the address people use`;
}
