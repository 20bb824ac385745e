import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { BadRequestError } from "@/lib/errors";
import { createMarkup, listMarkupJson } from "@/server/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { parseNewShapes } from "@/lib/markup/markup-input";
import { ifNoneMatchMatches } from "@/lib/markup/etag";

const params = z.object({ dieId: uuidSchema });

/** Room for 10,000 small shapes in one POST (a pad is about 300 bytes of JSON). */
const MAX_MARKUP_BODY_BYTES = 16 * 1024 * 1024;

/** All shapes of the die, with an ETag of their ids and versions; 304 when If-None-Match matches. */
export const GET = apiRoute({ params }, async ({ db, actor, params, req }) => {
  const { json, etag } = await listMarkupJson(db, actor, params.dieId);
  // private: answers depend on the caller's membership; no-cache: revalidate every time.
  const headers = { ETag: etag, "Cache-Control": "private, no-cache" };
  if (ifNoneMatchMatches(req.headers.get("if-none-match"), etag)) return new Response(null, { status: 304, headers });
  return new Response(json, { headers: { ...headers, "content-type": "application/json" } });
});

/** One shape or an array of up to 10,000, written in one transaction; 201 with what was created. */
export const POST = apiRoute({ params, body: z.unknown(), maxBodyBytes: MAX_MARKUP_BODY_BYTES }, async ({ db, actor, params, body }) => {
  const parsed = parseNewShapes(body);
  if (!parsed.ok) throw new BadRequestError(parsed.failure.message, parsed.failure.issues);
  const shapes = await createMarkup(db, actor, params.dieId, parsed.value.shapes, parsed.value.batch);
  return created(parsed.value.batch ? shapes : shapes[0]);
});
