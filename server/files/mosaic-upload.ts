import "server-only";
import Busboy from "busboy";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { Readable } from "node:stream";
import { AppError, BadRequestError, PayloadTooLargeError } from "@/lib/errors";
import { detectRasterFormat, MAGIC_BYTES_NEEDED, type RasterFormat } from "@/lib/tiles/magic-bytes";
import { findUnsafeText } from "@/lib/validation/unsafe-text";
import { MAX_MOSAIC_FRAMES } from "@/lib/validation/mosaics";
import { displayName, formatBytes, UNSUPPORTED } from "./upload";

/** How much of a refused upload's remaining body is read and discarded before the connection is cut. */
const DRAIN_BYTES = 256 * 1024 * 1024;

export type ReceivedFrame = { tempPath: string; bytes: number; format: RasterFormat; clientName: string };

/** How a refusal names the frame it is about: its place in capture order (1-based, as the dialog lists them) and file name. */
export const frameLabel = (index: number, name: string) => `Frame ${index + 1}${name ? ` (${name})` : ""}`;

/** Removes the temporary files of received frames (after a refusal, or once stored). */
export async function dropFrames(frames: readonly { tempPath: string }[]): Promise<void> {
  await Promise.all(frames.map((f) => fs.promises.rm(f.tempPath, { force: true })));
}

/**
 * Streams a multipart mosaic upload (fields, then parts named "file" in capture order) to one
 * temporary file per frame with busboy, checking each frame's first bytes as they arrive and
 * its size while streaming, like the single-micrograph upload. A refusal names the frame; on
 * any refusal every temporary file is deleted before the error is thrown.
 */
export async function receiveFrames(
  req: Request,
  opts: { maxBytes: number; incomingDir: string },
): Promise<{ fields: Record<string, string>; frames: ReceivedFrame[] }> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError(415, "Send the mosaic as multipart/form-data with the frames in parts named “file”, in capture order.");
  }
  if (!req.body) throw new BadRequestError("The request has no body.");
  fs.mkdirSync(opts.incomingDir, { recursive: true });
  const fields: Record<string, string> = {};
  const frames: ReceivedFrame[] = [];
  const writing: Promise<void>[] = [];
  const open = new Set<fs.WriteStream>();

  await new Promise<void>((resolve, reject) => {
    const bb = Busboy({
      headers: Object.fromEntries(req.headers),
      preservePath: true,
      limits: { files: MAX_MOSAIC_FRAMES, fileSize: opts.maxBytes, fields: 20, fieldSize: 4096, parts: MAX_MOSAIC_FRAMES + 20 },
    });
    const source = Readable.fromWeb(req.body as import("node:stream/web").ReadableStream);
    let failed = false;
    const fail = (e: Error) => {
      if (failed) return;
      failed = true;
      req.signal?.removeEventListener("abort", onAbort);
      source.unpipe(bb);
      bb.removeAllListeners();
      bb.on("error", () => {});
      for (const out of open) out.destroy();
      // A refusal before the body's end (a bad frame among good ones): read and discard the rest
      // up to a bound, so the client gets the answer instead of a reset connection; past the bound, cut.
      const drained = new Promise<void>((done) => {
        if (source.readableEnded || source.destroyed) return done();
        let left = DRAIN_BYTES;
        source.on("data", (chunk: Buffer) => {
          left -= chunk.length;
          if (left < 0) source.destroy();
        });
        source.on("end", done).on("close", done).on("error", done);
        source.resume();
      });
      Promise.allSettled([...writing, drained])
        .then(() => dropFrames(frames))
        .finally(() => reject(e));
    };
    const onAbort = () => fail(new BadRequestError("The upload was interrupted by the client."));
    if (req.signal?.aborted) return onAbort();
    req.signal?.addEventListener("abort", onAbort, { once: true });
    bb.on("field", (name, value, info) => {
      if (info.valueTruncated) return fail(new BadRequestError(`The field ${name} is too long.`));
      const unsafe = findUnsafeText({ [name]: value });
      if (unsafe) return fail(new BadRequestError(`Invalid upload: ${unsafe.path} ${unsafe.problem}.`, [{ path: unsafe.path, message: unsafe.problem }]));
      fields[name] = value;
    });
    bb.on("file", (name, stream, info) => {
      const index = frames.length;
      const clientName = info.filename ?? "";
      const refuse = (e: AppError) => {
        stream.resume();
        fail(new BadRequestError(`${frameLabel(index, displayName(clientName))}: ${e.message}`));
      };
      if (name !== "file") return refuse(new BadRequestError(`unexpected file field “${name}”: send every frame in a part named “file”.`));
      if (/[\\/]/.test(clientName) || clientName === "..") return refuse(new BadRequestError("the file name must be a plain name, without folders or “..”."));
      const frame: ReceivedFrame = {
        tempPath: path.join(opts.incomingDir, `${crypto.randomUUID()}.part`),
        bytes: 0,
        format: "jpeg",
        clientName: displayName(clientName),
      };
      frames.push(frame);
      const out = fs.createWriteStream(frame.tempPath, { flags: "wx" });
      open.add(out);
      writing.push(new Promise<void>((res) => out.on("close", () => (open.delete(out), res()))));
      out.on("error", (e) => fail(e));
      let head: Buffer = Buffer.alloc(0);
      let format: RasterFormat | null = null;
      stream.on("data", (chunk: Buffer) => {
        frame.bytes += chunk.length;
        if (!format && head.length < MAGIC_BYTES_NEEDED) {
          head = Buffer.concat([head, chunk.subarray(0, MAGIC_BYTES_NEEDED)]);
          if (head.length >= MAGIC_BYTES_NEEDED && !(format = detectRasterFormat(head))) {
            out.destroy();
            return refuse(new AppError(415, UNSUPPORTED));
          }
        }
      });
      stream.on("limit", () => {
        out.destroy();
        refuse(new PayloadTooLargeError(`the file is larger than the limit of ${formatBytes(opts.maxBytes)}.`));
      });
      stream.on("end", () => {
        if (failed) return;
        if (frame.bytes === 0) return refuse(new BadRequestError("the file is empty."));
        format ??= detectRasterFormat(head);
        if (!format) return refuse(new AppError(415, UNSUPPORTED));
        frame.format = format;
      });
      stream.pipe(out);
    });
    bb.on("error", (e) => fail(new BadRequestError(`The upload could not be read: ${(e as Error).message}.`)));
    bb.on("partsLimit", () => fail(new BadRequestError("Too many parts in the upload.")));
    bb.on("filesLimit", () => fail(new BadRequestError(`A mosaic takes at most ${MAX_MOSAIC_FRAMES} frames.`)));
    bb.on("fieldsLimit", () => fail(new BadRequestError("Too many fields in the upload.")));
    bb.on("close", () => {
      if (failed) return;
      Promise.all(writing).then(() => {
        if (failed) return;
        req.signal?.removeEventListener("abort", onAbort);
        resolve();
      });
    });
    source.on("error", (e) => fail(new BadRequestError(`The upload was interrupted: ${e.message}.`)));
    source.pipe(bb);
  });
  return { fields, frames };
}
