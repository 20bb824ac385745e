import "server-only";
import crypto from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import { env } from "../env";
import type { ObjectStore } from "./object-store";
import { localStore } from "./local-store";
import { s3Store } from "./s3-store";
import { s3Client, s3Settings } from "./s3-client";

/**
 * The process's object store, chosen by KERFLINE_STORAGE: the data dir (default) or an
 * S3-compatible bucket. Everything else a server writes to its own disk goes to `scratchDir()`.
 */
type Store = ObjectStore & { localPath?(key: string): string; ensureBucket?(): Promise<void> };

const g = globalThis as unknown as { __kerflineStore?: Store };

/**
 * `<data dir>/scratch`: upload parts, tiler work folders, downloads of originals and renders
 * before they are stored. Anything in it may be wiped at any time between jobs (start-up does);
 * in local mode it shares the store's file system, so a put is a rename.
 */
function scratchDir(...parts: string[]): string {
  return path.join(/*turbopackIgnore: true*/ env().dataDir, "scratch", ...parts);
}

/** Where uploads stream before they are accepted (and where the tus server keeps its parts). */
export const incomingDir = () => scratchDir("incoming");

export function objectStore(): Store {
  if (g.__kerflineStore) return g.__kerflineStore;
  const e = env();
  g.__kerflineStore = e.KERFLINE_STORAGE === "s3" ? s3Store(s3Client(), s3Settings().bucket) : localStore({ root: e.dataDir, tempDir: scratchDir("puts") });
  return g.__kerflineStore;
}

/**
 * Start-up: the scratch folder is there and the bucket exists (created when missing); in local
 * mode a data dir of the earlier layout gets its pyramid folders packed. Returns how many.
 */
export async function ensureStorageReady(): Promise<number> {
  await fs.mkdir(scratchDir(), { recursive: true });
  const store = objectStore();
  await store.ensureBucket?.();
  if (store.kind !== "local") return 0;
  const { packLegacyPyramids } = await import("./legacy-layout");
  return packLegacyPyramids(store, env().dataDir, scratchDir("legacy"));
}

/**
 * Empties the scratch folder of what is older than `olderThanMs` (0: everything, when this
 * process is the only one on its data dir, which the PGlite lock guarantees).
 */
export async function sweepScratch(olderThanMs: number): Promise<number> {
  const dir = scratchDir();
  const names = await fs.readdir(dir).catch(() => [] as string[]);
  let removed = 0;
  for (const name of names) {
    if (name === "incoming") continue; // swept by the upload sweeper, which knows its own rules
    const p = path.join(/*turbopackIgnore: true*/ dir, name);
    const s = await fs.stat(p).catch(() => null);
    if (!s || Date.now() - s.mtimeMs < olderThanMs) continue;
    await fs.rm(p, { recursive: true, force: true });
    removed++;
  }
  return removed;
}

/** A private folder in scratch for one job; remove it with `fs.rm(dir, { recursive: true })` in a finally. */
export async function scratchFolder(tag: string): Promise<string> {
  const dir = scratchDir(`${tag}-${crypto.randomUUID()}`);
  await fs.mkdir(dir, { recursive: true });
  return dir;
}

export type LocalFile = { path: string; release(): Promise<void> };

/**
 * A stored object as a local file for tools that need a path (sharp, libvips): the file
 * itself in local mode, a download to scratch otherwise. Null when there is no such object.
 */
export async function localCopy(key: string): Promise<LocalFile | null> {
  const store = objectStore();
  if (store.localPath) {
    const p = store.localPath(key);
    return (await store.stat(key)) ? { path: p, release: async () => {} } : null;
  }
  if (!(await store.stat(key))) return null;
  const dir = await scratchFolder("download");
  const p = path.join(/*turbopackIgnore: true*/ dir, path.basename(key));
  const release = () => fs.rm(dir, { recursive: true, force: true });
  try {
    await store.download(key, p);
  } catch (e) {
    await release();
    throw e;
  }
  return { path: p, release };
}
