import "server-only";
import crypto from "node:crypto";
import fs from "node:fs/promises";
import { MemoryLocker, Server, type Locker, type Upload } from "@tus/server";
import type { Pool } from "pg";
import { AppError, BadRequestError, NotFoundError, PayloadTooLargeError, UnauthorizedError } from "@/lib/errors";
import { detectRasterFormat, MAGIC_BYTES_NEEDED } from "@/lib/tiles/magic-bytes";
import { uuidSchema } from "@/lib/validation/common";
import { captureSchema } from "@/lib/validation/micrographs";
import { findUnsafeText } from "@/lib/validation/unsafe-text";
import { splitUploadMetadata, uploadTargetSchema } from "@/lib/validation/uploads";
import type { Actor } from "../access/context";
import { loadDie } from "../access/dies";
import { database, openedDatabase } from "../database";
import { env } from "../env";
import { ingestMicrograph } from "../files/ingest";
import { displayName, formatBytes, UNSUPPORTED } from "../files/upload";
import { assertSameOrigin, errorResponse, zodFailure } from "../http/route";
import { requireActor } from "../http/session";
import { PeekableBody } from "./peekable-body";
import { uploadStore, type UploadStore } from "./stores";
import { SharedUploadLocker } from "./shared-locker";

/**
 * Resumable micrograph uploads over the tus 1.0.0 protocol (https://tus.io/protocols/resumable-upload):
 * POST creates an upload (its id is a UUID, the last segment of Location), HEAD tells the offset
 * the server holds, PATCH appends from that offset, DELETE abandons it. Who may do what is
 * decided before any byte is stored; after the last byte the file goes through ingestMicrograph,
 * the same checks and recording as the multipart route, and the upload itself is removed.
 */
const UPLOADS_PATH = "/api/uploads";
/** Metadata key holding the creator; the client cannot set it (the metadata schema is strict). */
const OWNER_KEY = "owner";

type RequestContext = { actor: Actor; body?: PeekableBody };
type Tus = { server: Server; store: UploadStore };
// On globalThis, like the server itself: the start-up code (the sweep timer) and the route
// handler load this module separately, and the hooks must see the contexts the route sets.
const g = globalThis as unknown as { __kerflineTus?: Tus; __kerflineTusContexts?: WeakMap<Request, RequestContext> };
const contexts = (g.__kerflineTusContexts ??= new WeakMap<Request, RequestContext>());

function contextOf(req: Request): RequestContext {
  const found = contexts.get(req);
  if (!found) throw new UnauthorizedError();
  return found;
}

/** One process on the embedded database: the memory locker; on PostgreSQL, one shared by every web server. */
async function uploadLocker(): Promise<Locker> {
  const opened = await openedDatabase();
  if (opened.kind !== "postgres") return new MemoryLocker();
  // drizzle's node-postgres database keeps its pool as `$client`.
  return new SharedUploadLocker((opened.db as unknown as { $client: Pool }).$client);
}

function tus(): Tus {
  if (g.__kerflineTus) return g.__kerflineTus;
  const store = uploadStore();
  const server = new Server({
    path: UPLOADS_PATH,
    datastore: store.datastore,
    locker: uploadLocker(),
    namingFunction: () => `${store.prefix}${crypto.randomUUID()}`,
    // A relative Location (tus clients resolve it against the endpoint): right behind any proxy.
    generateUrl: (_req, { path, id }) => `${path}/${id.slice(store.prefix.length)}`,
    getFileIdFromRequest: (_req, last) => (last && uuidSchema.safeParse(last).success ? `${store.prefix}${last}` : undefined),
    // Same origin only: no Access-Control-Allow-Origin header for anyone.
    allowedOrigins: [],
    disableTerminationForFinishedUploads: true,
    onIncomingRequest: (req, id) => checkLaterRequest(store, req, id),
    onUploadCreate: (req, upload) => checkCreation(req, upload),
    onUploadFinish: (req, upload) => finishUpload(store, req, upload),
    onResponseError: async (_req, err) => ({ status_code: statusOf(err), body: JSON.stringify({ error: messageOf(err), ...extraOf(err) }) }),
  });
  g.__kerflineTus = { server, store };
  return g.__kerflineTus;
}

/** HEAD, PATCH and DELETE: only the creator; PATCH also needs the right to upload to the die now. */
async function checkLaterRequest(store: UploadStore, req: Request, id: string): Promise<void> {
  if (req.method === "POST") return;
  const { actor, body } = contextOf(req);
  const upload = await store.datastore.getUpload(id);
  // 404, not 403: someone else's upload id tells nothing about whether it exists.
  if (upload.metadata?.[OWNER_KEY] !== actor.userId) throw new NotFoundError("That upload");
  if (req.method !== "PATCH") return;
  await loadDie(await database(), actor, upload.metadata.dieId ?? "", "edit");
  // Only a PATCH that really starts the file (any other offset is tus's to refuse with 409).
  const startsFile = upload.offset === 0 && req.headers.get("upload-offset") === "0";
  if (startsFile && body && !(await looksLikeImage(body, upload.size))) {
    await store.discard(id);
    throw new AppError(415, UNSUPPORTED);
  }
}

/** The first bytes name an accepted format; undecided (a first chunk under 16 bytes) counts as yes. */
async function looksLikeImage(body: PeekableBody, size: number | undefined): Promise<boolean> {
  const need = Math.min(MAGIC_BYTES_NEEDED, size ?? MAGIC_BYTES_NEEDED);
  const head = await body.peek(need);
  return head.length < need || detectRasterFormat(head) !== null;
}

/** POST: signed in, metadata valid, may upload to the die, a known size within the limit. */
async function checkCreation(req: Request, upload: Upload): Promise<{ metadata: Record<string, string> }> {
  const { actor, body } = contextOf(req);
  const { target, capture } = splitUploadMetadata(upload.metadata ?? {});
  const unsafe = findUnsafeText({ ...target, ...capture });
  if (unsafe) throw new BadRequestError(`Invalid upload: ${unsafe.path} ${unsafe.problem}.`, [{ path: unsafe.path, message: unsafe.problem }]);
  const t = uploadTargetSchema.safeParse(target);
  if (!t.success) throw zodFailure(t.error, "upload metadata");
  const c = captureSchema.safeParse(capture);
  if (!c.success) throw zodFailure(c.error, "capture data");
  if (/[\\/]/.test(t.data.filename) || t.data.filename === "..") throw new BadRequestError("The file name must be a plain name, without folders or “..”.");
  await loadDie(await database(), actor, t.data.dieId, "edit");
  if (upload.sizeIsDeferred || upload.size === undefined)
    throw new BadRequestError("Send Upload-Length: the size of the file must be known when the upload is created.");
  if (upload.size === 0) throw new BadRequestError("The file is empty.");
  const max = env().KERFLINE_MAX_UPLOAD_BYTES;
  if (upload.size > max) throw new PayloadTooLargeError(`The file is larger than the limit of ${formatBytes(max)}.`);
  // Creation with upload (bytes in the POST itself): the same early look at the first bytes.
  if (body && !(await looksLikeImage(body, upload.size))) throw new AppError(415, UNSUPPORTED);
  return { metadata: { ...capture, dieId: t.data.dieId, filename: t.data.filename, [OWNER_KEY]: actor.userId } };
}

/**
 * After the last byte: the multipart route's checks and recording (ingestMicrograph) on a local
 * copy, answered with the micrograph (200 with a JSON body, which tus clients accept on a PATCH).
 * The upload is removed whatever the outcome, so a refused file leaves nothing behind.
 */
async function finishUpload(store: UploadStore, req: Request, upload: Upload) {
  const { actor } = contextOf(req);
  const { [OWNER_KEY]: _owner, ...rest } = upload.metadata ?? {};
  const { target, capture } = splitUploadMetadata(rest);
  let tempPath: string | null = null;
  try {
    tempPath = await store.localCopy(upload);
    const format = detectRasterFormat(await readHead(tempPath));
    if (!format) throw new AppError(415, UNSUPPORTED);
    const file = { tempPath, bytes: upload.size ?? 0, format, clientName: displayName(target.filename ?? "") };
    const micrograph = await ingestMicrograph(await database(), actor, target.dieId ?? "", file, capture);
    return { status_code: 200, headers: { "Content-Type": "application/json" }, body: JSON.stringify(micrograph) };
  } catch (e) {
    if (tempPath) await fs.rm(tempPath, { force: true });
    throw e;
  } finally {
    await store.discard(upload.id).catch((e) => console.error(`[kerfline] could not remove finished upload ${upload.id}:`, e));
  }
}

async function readHead(file: string): Promise<Buffer> {
  const handle = await fs.open(file, "r");
  try {
    const head = Buffer.alloc(MAGIC_BYTES_NEEDED);
    const { bytesRead } = await handle.read(head, 0, head.length, 0);
    return head.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

type TusError = { status_code: number; body: string };
const isTusError = (e: unknown): e is TusError => typeof e === "object" && e !== null && "status_code" in e && "body" in e;

/** The protocol's own refusals, in the API's words. */
const TUS_MESSAGES: Record<number, string> = {
  404: "That upload was not found.",
  409: "Upload-Offset does not match the bytes the server holds: ask with HEAD and resume from there.",
  410: "That upload has expired or was removed; start it again.",
};

function statusOf(err: unknown): number {
  if (err instanceof AppError) return err.status;
  if (isTusError(err)) return err.status_code;
  return 500;
}

function messageOf(err: unknown): string {
  if (err instanceof AppError) return err.message;
  if (isTusError(err)) return TUS_MESSAGES[err.status_code] ?? err.body.trim();
  console.error("[kerfline] unhandled error in an upload:", err);
  return "Something went wrong on the server. The upload was not recorded.";
}

const extraOf = (err: unknown) => (err instanceof AppError ? err.extra : {});

/**
 * The route's one entry: same-origin writes, signed-in caller, the id in the path, then the tus
 * handler. Every refusal is `{ error }` JSON like the rest of the API (tus clients read the body).
 */
export async function handleUploadRequest(req: Request, segments: string[] | undefined): Promise<Response> {
  try {
    if (req.method === "OPTIONS") return await tus().server.handleWeb(req);
    assertSameOrigin(req);
    const actor = await requireActor();
    const withId = (segments?.length ?? 0) > 0;
    if (req.method === "POST" ? withId : segments?.length !== 1 || !uuidSchema.safeParse(segments[0]).success) throw new NotFoundError("That upload");
    let request = req;
    let body: PeekableBody | undefined;
    if ((req.method === "PATCH" || req.method === "POST") && req.body) {
      body = new PeekableBody(req.body);
      const peekable = body;
      req.signal?.addEventListener("abort", () => peekable.abort(), { once: true });
      request = new Request(req.url, { method: req.method, headers: req.headers, body: body.stream(), duplex: "half" } as RequestInit);
    }
    contexts.set(request, { actor, body });
    return asJsonError(req, await tus().server.handleWeb(request));
  } catch (e) {
    const res = errorResponse(e);
    res.headers.set("Tus-Resumable", "1.0.0");
    return req.method === "HEAD" ? new Response(null, { status: res.status, headers: res.headers }) : res;
  }
}

/** Refusals the tus handler wrote as plain text (header checks) become `{ error }` JSON too. */
async function asJsonError(req: Request, res: Response): Promise<Response> {
  if (res.status < 400) return res;
  const text = await res.text();
  let body = text;
  try {
    if (typeof (JSON.parse(text) as { error?: unknown }).error !== "string") throw new Error("not ours");
  } catch {
    body = JSON.stringify({ error: text.trim() || `The upload request was refused (${res.status}).` });
  }
  const headers = new Headers(res.headers);
  headers.set("Content-Type", "application/json");
  headers.delete("Content-Length");
  return new Response(req.method === "HEAD" ? null : body, { status: res.status, headers });
}
