import "server-only";
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Readable } from "node:stream";
import { parseTileRequest, resolveTilePath, type PyramidDescription } from "@/lib/tiles/iiif";
import { API_CONTENT_SECURITY_POLICY, COMMON_SECURITY_HEADERS } from "@/lib/http/security-headers";

/**
 * The tile fast path. A viewer reads hundreds of tiles of one micrograph within seconds; the full
 * route (Next.js routing, session decoding, three queries for the team check) costs several times
 * a static file server per tile. So when the full route has served a tile, it approves further
 * tile reads of that micrograph for that exact session cookie for APPROVAL_MS, and the web
 * process's HTTP server (scripts/serve.mjs) answers those here, before Next.js: same bytes, same
 * headers, same 304s. Anything not approved, malformed or unusual goes the full way. A revoked
 * right (sign-out everywhere, removal from the team, deletion) therefore reaches tiles within
 * APPROVAL_MS — the browser keeps tiles it already has for a year anyway (`immutable`).
 */
const APPROVAL_MS = 10_000;
const MAX_APPROVALS = 20_000;

export type ApprovedPyramid = {
  description: PyramidDescription;
  /** Opens one tile by its path inside the pyramid; null when it is not there. */
  open(rel: string): Promise<{ body: Readable; size: number } | null>;
};

type Approval = { until: number; pyramid: ApprovedPyramid };

const g = globalThis as unknown as {
  __kerflineTileApprovals?: Map<string, Approval>;
  __kerflineFastTiles?: (req: IncomingMessage, res: ServerResponse) => boolean;
};
const approvals = (g.__kerflineTileApprovals ??= new Map<string, Approval>());

/** The session cookie's value(s) in a Cookie header (Auth.js may split a large one into `.0`, `.1`…). */
function sessionKeyOf(cookieHeader: string | null | undefined): string | null {
  if (!cookieHeader) return null;
  const parts = cookieHeader
    .split(";")
    .map((c) => c.trim())
    .filter((c) => /^(__Secure-)?authjs\.session-token(\.\d+)?=/.test(c))
    .sort();
  return parts.length ? parts.join(";") : null;
}

/** Called by the tile route after its full check passed: the next reads of this pyramid by this session may go the fast way. */
export function approveTileReads(cookieHeader: string | null, micrographId: string, pyramid: ApprovedPyramid): void {
  const session = sessionKeyOf(cookieHeader);
  if (!session) return;
  if (approvals.size >= MAX_APPROVALS) {
    const now = Date.now();
    for (const [k, a] of approvals) if (a.until < now) approvals.delete(k);
    // Still full: drop the oldest (a Map iterates in insertion order).
    while (approvals.size >= MAX_APPROVALS) approvals.delete(approvals.keys().next().value!);
  }
  const key = `${micrographId}|${session}`;
  approvals.delete(key);
  approvals.set(key, { until: Date.now() + APPROVAL_MS, pyramid });
}

/** Forgets every approval for a micrograph (re-tiled or deleted in this process). */
export function withdrawTileReads(micrographId: string): void {
  for (const k of approvals.keys()) if (k.startsWith(`${micrographId}|`)) approvals.delete(k);
}

const TILE_URL = /^\/api\/micrographs\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})\/iiif\/([^/?]+)\/([^/?]+)\/0\/default\.jpg$/;

const HEADERS = { ...COMMON_SECURITY_HEADERS, "Content-Security-Policy": API_CONTENT_SECURITY_POLICY };

/** The fast path's answer for one request, or false to let Next.js handle it. */
export function fastTile(req: IncomingMessage, res: ServerResponse): boolean {
  if (req.method !== "GET" && req.method !== "HEAD") return false;
  const m = TILE_URL.exec(req.url ?? "");
  if (!m) return false;
  const session = sessionKeyOf(req.headers.cookie);
  if (!session) return false;
  const [, micrographId, region, size] = m;
  const approval = approvals.get(`${micrographId}|${session}`);
  if (!approval || approval.until < Date.now()) return false;
  const request = parseTileRequest(decodeURIComponent(region), decodeURIComponent(size));
  const rel = request && resolveTilePath(request, approval.pyramid.description);
  if (!rel) return false;
  const tag = `"${micrographId}/${decodeURIComponent(region)}/${decodeURIComponent(size)}"`;
  const headers = { ...HEADERS, "content-type": "image/jpeg", "cache-control": "private, max-age=31536000, immutable", etag: tag };
  if (req.headers["if-none-match"] === tag) {
    res.writeHead(304, headers).end();
    return true;
  }
  approval.pyramid.open(rel).then(
    (tile) => {
      if (!tile) return void res.writeHead(404, { ...HEADERS, "content-type": "application/json" }).end(JSON.stringify({ error: "That tile was not found." }));
      res.writeHead(200, { ...headers, "content-length": String(tile.size) });
      if (req.method === "HEAD") {
        tile.body.destroy();
        res.end();
        return;
      }
      tile.body.on("error", () => res.destroy());
      tile.body.pipe(res);
    },
    () => {
      if (!res.headersSent) res.writeHead(500, { ...HEADERS, "content-type": "application/json" });
      res.end(JSON.stringify({ error: "The tile could not be read." }));
    },
  );
  return true;
}

/** Puts the fast path where the web process's HTTP server looks for it. */
export function installFastTiles(): void {
  g.__kerflineFastTiles = fastTile;
}
