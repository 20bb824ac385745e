import "server-only";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import type { Readable } from "node:stream";
import { DeleteObjectsCommand, GetObjectCommand } from "@aws-sdk/client-s3";
import { FileStore } from "@tus/file-store";
import { S3Store } from "@tus/s3-store";
import { MemoryKvStore, type DataStore, type Upload } from "@tus/server";
import type { MetadataValue } from "@tus/s3-store";
import { env } from "../env";
import { incomingDir } from "../storage";
import { s3Client, s3Settings } from "../storage/s3-client";

/** Where resumable uploads keep their bytes until the last one arrives and the checks run. */
export type UploadStore = {
  datastore: DataStore;
  /** Prefix of upload ids inside the store (the URL carries the bare UUID). */
  prefix: string;
  /** A local file with the finished upload's bytes; ingest consumes it (moves or deletes it). */
  localCopy(upload: Upload): Promise<string>;
  /** Removes everything the store keeps for an upload; pieces already gone are fine. */
  discard(id: string): Promise<void>;
  /** Removes unfinished uploads past the expiry; returns how many. */
  sweep(): Promise<number>;
};

/** Parts sent to S3 (the store's minimum is 5 MiB); the dialog's chunks are the same size. */
const UPLOAD_CHUNK_BYTES = 8 * 1024 ** 2;

const expiryMs = () => env().KERFLINE_UPLOAD_EXPIRY_HOURS * 3600_000;

/** The data dir's scratch folder for uploads: nothing in it is a record, all of it may be wiped. */
const localUploadsDir = () => path.join(/*turbopackIgnore: true*/ env().dataDir, "uploads");

function fileUploadStore(): UploadStore {
  const directory = localUploadsDir();
  fs.mkdirSync(directory, { recursive: true });
  const datastore = new FileStore({ directory, expirationPeriodInMilliseconds: expiryMs() });
  const discard = async (id: string) => {
    await fs.promises.rm(path.join(directory, id), { force: true });
    await fs.promises.rm(path.join(directory, `${id}.json`), { force: true });
  };
  return {
    datastore,
    prefix: "",
    // The store's own file: ingest renames it into originals/ (same file system) or deletes it.
    localCopy: async (upload) => path.join(directory, upload.id),
    discard,
    // Our own pass rather than FileStore.deleteExpired: that one stops at the first info file
    // whose bytes are already gone (a crash between ingest and clean-up), and never recovers.
    async sweep() {
      const names = await fs.promises.readdir(directory).catch(() => [] as string[]);
      let removed = 0;
      for (const name of names.filter((n) => n.endsWith(".json"))) {
        const id = name.slice(0, -".json".length);
        const info = await fs.promises
          .readFile(path.join(directory, name), "utf8")
          .then((t) => JSON.parse(t) as { creation_date?: string })
          .catch(() => null);
        const created = info?.creation_date ? Date.parse(info.creation_date) : NaN;
        if (Number.isFinite(created) && Date.now() - created <= expiryMs()) continue;
        await discard(id);
        removed++;
      }
      return removed;
    },
  };
}

function s3UploadStore(): UploadStore {
  const { bucket, client } = s3Settings();
  // Our own handle on the store's metadata cache, to forget an upload we delete ourselves.
  const cache = new MemoryKvStore<MetadataValue>();
  const datastore = new S3Store({
    cache,
    partSize: UPLOAD_CHUNK_BYTES,
    expirationPeriodInMilliseconds: expiryMs(),
    // Checksums only where S3 requires them: the SDK's default sends streamed bodies as
    // aws-chunked with a trailing checksum, which several S3-compatible stores (s3rver among
    // them) store as part of the object, adding bytes to every incomplete part.
    s3ClientConfig: { bucket, ...client, requestChecksumCalculation: "WHEN_REQUIRED", responseChecksumValidation: "WHEN_REQUIRED" },
  });
  return {
    datastore,
    prefix: "uploads/",
    async localCopy(upload) {
      fs.mkdirSync(incomingDir(), { recursive: true });
      const target = path.join(incomingDir(), `${crypto.randomUUID()}.part`);
      try {
        const object = await s3Client().send(new GetObjectCommand({ Bucket: bucket, Key: upload.id }));
        await pipeline(object.Body as Readable, fs.createWriteStream(target, { flags: "wx" }));
      } catch (e) {
        await fs.promises.rm(target, { force: true });
        throw e;
      }
      return target;
    },
    async discard(id) {
      // remove() aborts an unfinished multipart upload; after completion it has none and throws.
      await datastore.remove(id).catch(() => undefined);
      const keys = [id, `${id}.info`, `${id}.part`].map((Key) => ({ Key }));
      await s3Client().send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: keys, Quiet: true } }));
      await cache.delete(id);
    },
    sweep: () => datastore.deleteExpired(),
  };
}

const g = globalThis as unknown as { __kerflineUploadStore?: UploadStore };

/**
 * The process's one store for the configured storage (KERFLINE_STORAGE), shared by the tus
 * server and the housekeeping sweep (on globalThis: they load this module separately).
 */
export function uploadStore(): UploadStore {
  g.__kerflineUploadStore ??= env().KERFLINE_STORAGE === "s3" ? s3UploadStore() : fileUploadStore();
  return g.__kerflineUploadStore;
}

/**
 * Removes resumable uploads left unfinished past KERFLINE_UPLOAD_EXPIRY_HOURS (their bytes and
 * info); returns how many. Safe to run at any time and from any process sharing the store. Here,
 * not beside the tus server, so a worker process does not load the HTTP and session code.
 */
export function sweepAbandonedUploads(): Promise<number> {
  return uploadStore().sweep();
}
