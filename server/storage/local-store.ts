import "server-only";
import crypto from "node:crypto";
import fs from "node:fs";
import fsp from "node:fs/promises";
import path from "node:path";
import type { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { ByteRange, ObjectStore, StoredObject } from "./object-store";

/** Keys are '/'-separated segments of letters, digits, '.', '_' and '-'; never '..' or empty parts. */
const KEY = /^[A-Za-z0-9_-][A-Za-z0-9._-]*(\/[A-Za-z0-9_-][A-Za-z0-9._-]*)*$/;

export function checkKey(key: string): string {
  if (!KEY.test(key) || key.length > 512) throw new Error(`not a storage key: ${key}`);
  return key;
}

export function checkPrefix(prefix: string): string {
  if (!prefix.endsWith("/")) throw new Error(`a prefix ends with '/': ${prefix}`);
  checkKey(prefix.slice(0, -1));
  return prefix;
}

const missing = (e: unknown) => (e as NodeJS.ErrnoException).code === "ENOENT";

/** Size and modification time identify one version of a file: every put writes a new file. */
const etagOf = (s: fs.Stats) => `${s.size.toString(16)}-${Math.round(s.mtimeMs * 1000).toString(16)}`;

/**
 * The object store on local disk: `<root>/<key>`. A put writes (or hard-links) the bytes under a
 * temporary name in `tempDir` — a folder on the same file system, the scratch folder — and
 * renames it over the key, so readers see the old file or the whole new one, and a killed
 * process leaves its half-written file only in scratch.
 */
export function localStore(opts: { root: string; tempDir: string }): ObjectStore & { localPath(key: string): string } {
  const file = (key: string) => path.join(/*turbopackIgnore: true*/ opts.root, ...checkKey(key).split("/"));
  const temp = async () => {
    await fsp.mkdir(opts.tempDir, { recursive: true });
    return path.join(/*turbopackIgnore: true*/ opts.tempDir, `put-${crypto.randomUUID()}`);
  };
  const place = async (key: string, write: (t: string) => Promise<void>): Promise<StoredObject> => {
    const target = file(key);
    const t = await temp();
    try {
      await write(t);
      await fsp.mkdir(path.dirname(target), { recursive: true });
      await fsp.rename(t, target);
    } catch (e) {
      await fsp.rm(t, { force: true });
      throw e;
    }
    const s = await fsp.stat(target);
    return { size: s.size, etag: etagOf(s) };
  };
  const stat = async (key: string): Promise<StoredObject | null> => {
    try {
      const s = await fsp.stat(file(key));
      return s.isFile() ? { size: s.size, etag: etagOf(s) } : null;
    } catch (e) {
      if (missing(e)) return null;
      throw e;
    }
  };
  const list = async (prefix: string): Promise<string[]> => {
    const dir = file(checkPrefix(prefix).slice(0, -1));
    const entries = await fsp.readdir(dir, { recursive: true, withFileTypes: true }).catch((e) => {
      if (missing(e) || (e as NodeJS.ErrnoException).code === "ENOTDIR") return [];
      throw e;
    });
    return entries
      .filter((e) => e.isFile())
      .map((e) => prefix + path.relative(dir, path.join(e.parentPath, e.name)).split(path.sep).join("/"))
      .sort();
  };
  return {
    kind: "local",
    localPath: file,
    // A hard link costs nothing for a multi-gigabyte original; a copy when the file is elsewhere.
    putFile: (key, src) => place(key, (t) => fsp.link(src, t).catch(() => fsp.copyFile(src, t))),
    putBuffer: (key, body) => place(key, (t) => fsp.writeFile(t, body)),
    async read(key: string, range?: ByteRange): Promise<Readable | null> {
      const stream = fs.createReadStream(file(key), range ? { start: range.start, end: range.end } : {});
      // Opening is asynchronous: wait for it so a missing file is a null, not a stream error.
      return new Promise((resolve, reject) => {
        stream.once("open", () => resolve(stream));
        stream.once("error", (e) => (missing(e) ? resolve(null) : reject(e)));
      });
    },
    stat,
    async download(key, dest) {
      const src = await this.read(key);
      if (!src) throw new Error(`no stored object ${key}`);
      await pipeline(src, fs.createWriteStream(dest));
    },
    async remove(key) {
      await fsp.rm(file(key), { force: true });
    },
    async removePrefix(prefix) {
      await fsp.rm(file(checkPrefix(prefix).slice(0, -1)), { recursive: true, force: true });
    },
    list,
  };
}
