import "server-only";
import fs from "node:fs";
import type { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  type S3Client,
} from "@aws-sdk/client-s3";
import { Upload } from "@aws-sdk/lib-storage";
import type { ByteRange, ObjectStore, StoredObject } from "./object-store";
import { checkKey, checkPrefix } from "./local-store";

/**
 * Multipart settings of a file upload: 8 MiB parts (S3's minimum is 5 MiB), two in flight, so one
 * upload holds about 16 MiB whatever the file's size (lib-storage buffers `queueSize` parts).
 */
export const PART_SIZE = 8 * 1024 * 1024;
const QUEUE_SIZE = 2;
/** DeleteObjects takes at most 1000 keys per request (S3 API reference). */
const DELETE_BATCH = 1000;

const status = (e: unknown) => (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
const notFound = (e: unknown) => status(e) === 404 || ["NoSuchKey", "NotFound"].includes((e as Error).name);
const unquote = (etag: string | undefined) => (etag ?? "").replace(/^W\//, "").replace(/"/g, "");

/** An S3-compatible bucket as the object store, through one pooled client. */
export function s3Store(client: S3Client, bucket: string, opts: { partSize?: number } = {}): ObjectStore & { ensureBucket(): Promise<void> } {
  const stat = async (key: string): Promise<StoredObject | null> => {
    try {
      const h = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: checkKey(key) }));
      return { size: h.ContentLength ?? 0, etag: unquote(h.ETag) };
    } catch (e) {
      if (notFound(e)) return null;
      throw e;
    }
  };
  const read = async (key: string, range?: ByteRange): Promise<Readable | null> => {
    try {
      const r = await client.send(new GetObjectCommand({ Bucket: bucket, Key: checkKey(key), Range: range ? `bytes=${range.start}-${range.end}` : undefined }));
      return r.Body as Readable;
    } catch (e) {
      if (notFound(e)) return null;
      throw e;
    }
  };
  const list = async (prefix: string): Promise<string[]> => {
    const keys: string[] = [];
    let token: string | undefined;
    do {
      const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: checkPrefix(prefix), ContinuationToken: token }));
      for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return keys.sort();
  };
  return {
    kind: "s3",
    async putFile(key, file, contentType) {
      const size = (await fs.promises.stat(file)).size;
      // lib-storage sends one PutObject below a part's size, a multipart upload above it; a
      // failed multipart upload is aborted (leavePartsOnError false), so no parts linger.
      const upload = new Upload({
        client,
        params: { Bucket: bucket, Key: checkKey(key), Body: fs.createReadStream(file), ContentType: contentType },
        partSize: opts.partSize ?? PART_SIZE,
        queueSize: QUEUE_SIZE,
        leavePartsOnError: false,
      });
      const done = await upload.done();
      return { size, etag: unquote(done.ETag) };
    },
    async putBuffer(key, body, contentType) {
      const r = await client.send(new PutObjectCommand({ Bucket: bucket, Key: checkKey(key), Body: body, ContentType: contentType }));
      return { size: body.length, etag: unquote(r.ETag) };
    },
    read,
    stat,
    async download(key, dest) {
      const body = await read(key);
      if (!body) throw new Error(`no stored object ${key}`);
      await pipeline(body, fs.createWriteStream(dest));
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: checkKey(key) }));
    },
    async removePrefix(prefix) {
      const keys = await list(prefix);
      for (let i = 0; i < keys.length; i += DELETE_BATCH) {
        const batch = keys.slice(i, i + DELETE_BATCH);
        const r = await client.send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } }));
        if (r.Errors?.length) throw new Error(`could not delete ${r.Errors.length} object(s) under ${prefix}: ${r.Errors[0].Message ?? r.Errors[0].Code}`);
      }
    },
    list,
    /** The app creates a missing bucket at start (HeadBucket, then CreateBucket on 404). */
    async ensureBucket() {
      try {
        await client.send(new HeadBucketCommand({ Bucket: bucket }));
      } catch (e) {
        if (!notFound(e)) throw e;
        await client.send(new CreateBucketCommand({ Bucket: bucket })).catch((err: Error) => {
          if (err.name !== "BucketAlreadyOwnedByYou") throw err;
        });
      }
    },
  };
}
