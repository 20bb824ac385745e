import "server-only";
import { env } from "./env";

/** The absolute origin clients reach us at: KERFLINE_PUBLIC_URL when set, else the request's. */
export function publicOrigin(req: Request): string {
  const configured = env().KERFLINE_PUBLIC_URL;
  if (configured) return configured.replace(/\/$/, "");
  const url = new URL(req.url);
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host") ?? url.host;
  const proto = req.headers.get("x-forwarded-proto") ?? url.protocol.replace(":", "");
  return `${proto}://${host}`;
}
