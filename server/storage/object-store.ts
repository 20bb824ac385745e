import type { Readable } from "node:stream";

/**
 * The one interface every stored file goes through: originals, pyramids, previews, thumbnails,
 * exports and reports. Two implementations: the data dir (the embedded default) and an
 * S3-compatible bucket. Keys are '/'-separated, built only from server-made UUIDs and fixed
 * names, and laid out per die (`<area>/<dieId>/…`) so one prefix removal deletes a die's files.
 */
export type StoredObject = { size: number; etag: string };

export type ByteRange = { start: number; end: number }; // inclusive, as HTTP Range

export interface ObjectStore {
  readonly kind: "local" | "s3";
  /** Stores a local file under `key`; readers see the old object or the whole new one, never part. */
  putFile(key: string, file: string, contentType?: string): Promise<StoredObject>;
  putBuffer(key: string, body: Buffer, contentType?: string): Promise<StoredObject>;
  /** Streams an object or one byte range of it; null when there is no such object. */
  read(key: string, range?: ByteRange): Promise<Readable | null>;
  stat(key: string): Promise<StoredObject | null>;
  /** Copies an object to a local file (a scratch path), for tools that need a path. */
  download(key: string, file: string): Promise<void>;
  remove(key: string): Promise<void>;
  /** Removes every object whose key starts with `prefix` (which must end with '/'). */
  removePrefix(prefix: string): Promise<void>;
  /** Keys under a prefix, for sweeps and tests. */
  list(prefix: string): Promise<string[]>;
}
