import "server-only";
import Busboy from "busboy";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { Readable } from "node:stream";
import { AppError, BadRequestError, PayloadTooLargeError } from "@/lib/errors";
import { detectRasterFormat, MAGIC_BYTES_NEEDED, type RasterFormat } from "@/lib/tiles/magic-bytes";
import { findUnsafeText } from "@/lib/validation/unsafe-text";

export type ReceivedUpload = {
  fields: Record<string, string>;
  file: { tempPath: string; bytes: number; format: RasterFormat; clientName: string };
};

export const UNSUPPORTED = "Only JPEG, PNG, TIFF (including BigTIFF) and WebP micrographs are accepted; this file is none of those.";

/** A client file name for display: its last path part, without control characters. */
export function displayName(raw: string): string {
  const base = raw.split(/[\\/]/).pop() ?? "";
  return base
    .replace(/[\u0000-\u001f\u007f]/g, "")
    .trim()
    .slice(0, 200);
}

/**
 * Streams a multipart upload to a temporary file with busboy: memory does not grow with the
 * file. The first bytes are checked against the accepted formats as soon as they arrive, so a
 * wrong file is refused without receiving all of it; size is capped while streaming. On any
 * refusal the partial file is deleted before the error is thrown.
 */
export async function receiveUpload(req: Request, opts: { maxBytes: number; incomingDir: string }): Promise<ReceivedUpload> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError(415, "Send the micrograph as multipart/form-data with the image in the field “file”.");
  }
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > opts.maxBytes + 64 * 1024) throw new PayloadTooLargeError(`The file is larger than the limit of ${formatBytes(opts.maxBytes)}.`);
  if (!req.body) throw new BadRequestError("The request has no body.");
  fs.mkdirSync(opts.incomingDir, { recursive: true });
  const tempPath = path.join(opts.incomingDir, `${crypto.randomUUID()}.part`);
  const fields: Record<string, string> = {};
  let file: ReceivedUpload["file"] | null = null;

  const work = new Promise<void>((resolve, reject) => {
    const bb = Busboy({
      headers: Object.fromEntries(req.headers),
      // Keep the client's path so a name with folders or ".." can be refused, not silently cut.
      preservePath: true,
      limits: { files: 1, fileSize: opts.maxBytes, fields: 20, fieldSize: 4096, parts: 30 },
    });
    const source = Readable.fromWeb(req.body as import("node:stream/web").ReadableStream);
    let failed = false;
    let writing: Promise<void> = Promise.resolve();
    let out: fs.WriteStream | null = null;
    const fail = (e: Error) => {
      if (failed) return;
      failed = true;
      req.signal?.removeEventListener("abort", onAbort);
      source.unpipe(bb);
      source.destroy();
      bb.removeAllListeners();
      bb.on("error", () => {});
      // Close the part file's handle now (an open stream would never finish), then delete it.
      out?.destroy();
      writing.finally(() => fs.rm(tempPath, { force: true }, () => reject(e)));
    };
    // A client that drops the connection: stop at once rather than wait for a body that never ends.
    const onAbort = () => fail(new BadRequestError("The upload was interrupted by the client."));
    if (req.signal?.aborted) return onAbort();
    req.signal?.addEventListener("abort", onAbort, { once: true });
    bb.on("field", (name, value, info) => {
      if (info.valueTruncated) return fail(new BadRequestError(`The field ${name} is too long.`));
      // The same check as JSON bodies: PostgreSQL text refuses NUL (busboy has already turned
      // bytes that are not UTF-8 into U+FFFD, so surrogates cannot arrive here).
      const unsafe = findUnsafeText({ [name]: value });
      if (unsafe) return fail(new BadRequestError(`Invalid upload: ${unsafe.path} ${unsafe.problem}.`, [{ path: unsafe.path, message: unsafe.problem }]));
      fields[name] = value;
    });
    bb.on("file", (name, stream, info) => {
      if (name !== "file") {
        stream.resume();
        return fail(new BadRequestError(`Unexpected file field “${name}”: send the image in the field “file”.`));
      }
      const clientName = info.filename ?? "";
      if (/[\\/]/.test(clientName) || clientName === "..") {
        stream.resume();
        return fail(new BadRequestError("The file name must be a plain name, without folders or “..”."));
      }
      out = fs.createWriteStream(tempPath, { flags: "wx" });
      const file$ = out;
      let bytes = 0;
      let head: Buffer = Buffer.alloc(0);
      let format: RasterFormat | null = null;
      writing = new Promise<void>((res) => file$.on("close", () => res()));
      file$.on("error", (e) => fail(e));
      stream.on("data", (chunk: Buffer) => {
        bytes += chunk.length;
        if (!format && head.length < MAGIC_BYTES_NEEDED) {
          head = Buffer.concat([head, chunk.subarray(0, MAGIC_BYTES_NEEDED)]);
          if (head.length >= MAGIC_BYTES_NEEDED) {
            format = detectRasterFormat(head);
            if (!format) {
              stream.resume();
              file$.destroy();
              return fail(new AppError(415, UNSUPPORTED));
            }
          }
        }
      });
      stream.on("limit", () => {
        file$.destroy();
        fail(new PayloadTooLargeError(`The file is larger than the limit of ${formatBytes(opts.maxBytes)}.`));
      });
      stream.on("end", () => {
        if (failed) return;
        if (bytes === 0) return fail(new BadRequestError("The file is empty."));
        format ??= detectRasterFormat(head);
        if (!format) return fail(new AppError(415, UNSUPPORTED));
        file = { tempPath, bytes, format, clientName: displayName(clientName) };
      });
      stream.pipe(file$);
    });
    bb.on("error", (e) => fail(new BadRequestError(`The upload could not be read: ${(e as Error).message}.`)));
    bb.on("partsLimit", () => fail(new BadRequestError("Too many parts in the upload.")));
    bb.on("filesLimit", () => fail(new BadRequestError("Send one micrograph per upload.")));
    bb.on("fieldsLimit", () => fail(new BadRequestError("Too many fields in the upload.")));
    bb.on("close", () => {
      if (failed) return;
      writing.then(() => {
        if (failed) return;
        if (!file) return fail(new BadRequestError("No file was sent: put the image in the field “file”."));
        req.signal?.removeEventListener("abort", onAbort);
        resolve();
      });
    });
    source.on("error", (e) => fail(new BadRequestError(`The upload was interrupted: ${e.message}.`)));
    source.pipe(bb);
  });
  await work;
  return { fields, file: file! };
}

export function formatBytes(n: number): string {
  if (n >= 1024 ** 3) return `${(n / 1024 ** 3).toFixed(n % 1024 ** 3 === 0 ? 0 : 1)} GB`;
  if (n >= 1024 ** 2) return `${(n / 1024 ** 2).toFixed(0)} MB`;
  return `${n} bytes`;
}

/**
 * Deletes part files a crash left in the incoming folder. On the embedded database only this
 * process uses the data dir, so all of them; with a shared server, those untouched for an hour.
 */
export async function sweepIncoming(incomingDir: string, onlyOlderThanMs = 0): Promise<number> {
  const names = await fs.promises.readdir(incomingDir).catch(() => [] as string[]);
  let removed = 0;
  for (const name of names) {
    if (!name.endsWith(".part")) continue;
    const p = path.join(incomingDir, name);
    const st = await fs.promises.stat(p).catch(() => null);
    if (!st || Date.now() - st.mtimeMs < onlyOlderThanMs) continue;
    await fs.promises.rm(p, { force: true });
    removed++;
  }
  return removed;
}
