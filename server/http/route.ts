import "server-only";
import { z } from "zod";
import { AppError, BadRequestError, PayloadTooLargeError } from "@/lib/errors";
import { requireActor } from "./session";
import { database } from "@/server/database";
import { type Database } from "@/db/client";
import type { Actor } from "@/server/access/context";
import { assertPathMember } from "@/server/access/path-scope";
import { findUnsafeText } from "@/lib/validation/unsafe-text";
import { sameOriginVerdict } from "./origin";

/** JSON bodies above this are refused with 413 before parsing. */
const MAX_JSON_BYTES = 1024 * 1024;

type Ctx<P, B, Q> = { actor: Actor; db: Database; params: P; body: B; query: Q; req: Request };

type Options<P extends z.ZodType, B extends z.ZodType, Q extends z.ZodType> = {
  params?: P;
  body?: B;
  query?: Q;
  maxBodyBytes?: number;
  /** Signed-out callers get 401 unless this is false. */
  signedIn?: boolean;
};

/** Turns zod issues into the API's `{ error, issues }` shape. */
export function zodFailure(error: z.ZodError, where: string): BadRequestError {
  const issues = error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
  const first = issues[0];
  const summary = first ? `${first.path ? `${first.path}: ` : ""}${first.message}` : "invalid input";
  return new BadRequestError(`Invalid ${where}: ${summary}`, issues);
}

// JSON bodies: application/json (RFC 8259) and GeoJSON's registered type application/geo+json
// (RFC 7946 §12), compared on the media type alone so parameters such as charset pass.
const JSON_MEDIA_TYPES = new Set(["application/json", "application/geo+json"]);

function isJsonMediaType(header: string | null): boolean {
  const mediaType = (header ?? "").split(";")[0].trim().toLowerCase();
  return JSON_MEDIA_TYPES.has(mediaType);
}

async function readJson(req: Request, limit: number): Promise<unknown> {
  if (!isJsonMediaType(req.headers.get("content-type"))) {
    throw new AppError(415, "Send the request body as JSON (Content-Type: application/json or application/geo+json).");
  }
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > limit) throw new PayloadTooLargeError(`The request body is larger than ${limit} bytes.`);
  const reader = req.body?.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  while (reader) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw new PayloadTooLargeError(`The request body is larger than ${limit} bytes.`);
    }
    chunks.push(value);
  }
  const text = Buffer.concat(chunks).toString("utf8");
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    throw new BadRequestError("The request body is not valid JSON.");
  }
  // Checked before any schema so every text field of every route is covered the same way.
  const unsafe = findUnsafeText(parsed);
  if (unsafe) {
    const field = unsafe.path || "body";
    throw new BadRequestError(`Invalid request body: ${field} ${unsafe.problem}.`, [{ path: unsafe.path, message: unsafe.problem }]);
  }
  return parsed;
}

/** 403 for a non-GET/HEAD request whose Origin or Sec-Fetch-Site is not ours. */
export function assertSameOrigin(req: Request): void {
  const verdict = sameOriginVerdict(req);
  if (!verdict.ok) throw new AppError(403, verdict.reason);
}

/** Maps any thrown error to a JSON response; unknown errors become 500 without internals. */
export function errorResponse(e: unknown): Response {
  if (e instanceof AppError) return Response.json({ error: e.message, ...e.extra }, { status: e.status });
  console.error("[kerfline] unhandled error in route:", e);
  return Response.json({ error: "Something went wrong on the server. The change was not saved." }, { status: 500 });
}

/**
 * The one wrapper for JSON route handlers: same-origin check for writes (403), session (401), path params and query parsed with
 * zod (400), membership of what the path names (404) before a body is read, the body parsed
 * (400/413/415), the handler's domain call, and errors mapped to status codes. The specific
 * right (403) is checked in the data-access layer the handler calls.
 */
export function apiRoute<
  P extends z.ZodType = z.ZodType<Record<string, never>>,
  B extends z.ZodType = z.ZodType<undefined>,
  Q extends z.ZodType = z.ZodType<Record<string, never>>,
>(opts: Options<P, B, Q>, handler: (ctx: Ctx<z.infer<P>, z.infer<B>, z.infer<Q>>) => Promise<Response | unknown>) {
  return async (req: Request, context: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    try {
      // Before the session: a cookie sent along by another site's page must not act for anyone.
      assertSameOrigin(req);
      const actor = opts.signedIn === false ? ({ userId: "" } as Actor) : await requireActor();
      const rawParams = (await context?.params) ?? {};
      const params = opts.params ? opts.params.safeParse(rawParams) : { success: true as const, data: rawParams };
      if (!params.success) throw zodFailure(params.error, "path");
      const url = new URL(req.url);
      const query = opts.query ? opts.query.safeParse(Object.fromEntries(url.searchParams)) : { success: true as const, data: {} };
      if (!query.success) throw zodFailure(query.error, "query");
      const db = await database();
      let body: unknown = undefined;
      if (opts.body) {
        // Who may touch what the path names comes before what the body says (404 for outsiders).
        if (opts.signedIn !== false) await assertPathMember(db, actor, params.data as Record<string, unknown>);
        const parsed = opts.body.safeParse(await readJson(req, opts.maxBodyBytes ?? MAX_JSON_BYTES));
        if (!parsed.success) throw zodFailure(parsed.error, "body");
        body = parsed.data;
      }
      const result = await handler({ actor, db, params: params.data, body, query: query.data, req } as Ctx<z.infer<P>, z.infer<B>, z.infer<Q>>);
      return result instanceof Response ? result : Response.json(result);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

/** 201 with a JSON body. */
export const created = (data: unknown) => Response.json(data, { status: 201 });
/** 204 with no body. */
export const noContent = () => new Response(null, { status: 204 });
