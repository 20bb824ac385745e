import "server-only";
import { Readable } from "node:stream";
import { NotFoundError } from "@/lib/errors";
import { objectStore } from "../storage";

/** Bytes to send from the object store: a whole object or one range of it (a tile in a pack). */
export type StoredBody = { size: number; open(): Promise<Readable | null> };

/** A whole stored object as a body, or null when there is no such object. */
export async function storedBody(key: string): Promise<StoredBody | null> {
  const s = await objectStore().stat(key);
  return s && { size: s.size, open: () => objectStore().read(key) };
}

/**
 * Streams stored bytes that never change under their URL (tiles, previews of a micrograph id),
 * with strong caching: `immutable`, an ETag, and 304 for a matching If-None-Match (nothing is
 * read from the store then). `private` because access depends on the caller's team.
 */
export async function serveImmutable(req: Request, body: StoredBody | null, etag: string, contentType: string): Promise<Response> {
  const tag = `"${etag}"`;
  const headers = {
    "content-type": contentType,
    "cache-control": "private, max-age=31536000, immutable",
    etag: tag,
    "x-content-type-options": "nosniff",
  };
  if (!body) throw new NotFoundError("That tile");
  if (req.headers.get("if-none-match") === tag) return new Response(null, { status: 304, headers });
  const stream = await body.open();
  if (!stream) throw new NotFoundError("That tile");
  return new Response(Readable.toWeb(stream) as ReadableStream, { status: 200, headers: { ...headers, "content-length": String(body.size) } });
}
