import "server-only";
import fs from "node:fs";
import { Readable } from "node:stream";
import { NotFoundError } from "@/lib/errors";

/**
 * Streams a file that never changes under its URL (tiles, previews of a micrograph id), with
 * strong caching: `immutable`, an ETag, and 304 for a matching If-None-Match. `private`
 * because access depends on the caller's team.
 */
export async function serveImmutable(req: Request, file: string, etag: string, contentType: string): Promise<Response> {
  const tag = `"${etag}"`;
  const headers = {
    "content-type": contentType,
    "cache-control": "private, max-age=31536000, immutable",
    etag: tag,
    "x-content-type-options": "nosniff",
  };
  let size: number;
  try {
    size = (await fs.promises.stat(file)).size;
  } catch {
    throw new NotFoundError("That tile");
  }
  if (req.headers.get("if-none-match") === tag) return new Response(null, { status: 304, headers });
  const body = Readable.toWeb(fs.createReadStream(file)) as ReadableStream;
  return new Response(body, { status: 200, headers: { ...headers, "content-length": String(size) } });
}
