import "server-only";
import fs from "node:fs";
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { Readable } from "node:stream";
import type { PyramidDescription } from "@/lib/tiles/iiif";
import { decodeFooter, encodeFooter, FOOTER_BYTES, parseIndex, type PackIndex } from "@/lib/tiles/tile-pack";
import type { ObjectStore } from "./object-store";

/**
 * Writes the tile pack of a pyramid folder sharp wrote (IIIF 3 layout) to `outFile`: every
 * `.jpg` below it, in path order, then the index and the footer (lib/tiles/tile-pack.ts).
 * One tile in memory at a time.
 */
export async function writeTilePack(folder: string, pyramid: PyramidDescription, outFile: string): Promise<{ tiles: number; bytes: number }> {
  const entries = await readdir(folder, { recursive: true, withFileTypes: true });
  const names = entries
    .filter((e) => e.isFile() && e.name.endsWith(".jpg"))
    .map((e) => path.relative(folder, path.join(/*turbopackIgnore: true*/ e.parentPath, e.name)).split(path.sep).join("/"))
    .sort();
  const out = fs.createWriteStream(outFile);
  const closed = new Promise<void>((resolve, reject) => {
    out.once("close", resolve);
    out.once("error", reject);
  });
  const write = (b: Buffer) => (out.write(b) ? Promise.resolve() : new Promise<void>((r) => out.once("drain", () => r())));
  try {
    const tiles: Record<string, [number, number]> = {};
    let offset = 0;
    for (const name of names) {
      const bytes = await readFile(path.join(/*turbopackIgnore: true*/ folder, ...name.split("/")));
      tiles[name] = [offset, bytes.length];
      await write(bytes);
      offset += bytes.length;
    }
    const index = Buffer.from(JSON.stringify({ version: 1, pyramid, tiles } satisfies PackIndex));
    await write(index);
    await write(encodeFooter(offset, index.length));
    out.end();
    await closed;
    return { tiles: names.length, bytes: offset + index.length + FOOTER_BYTES };
  } catch (e) {
    out.destroy();
    await closed.catch(() => {});
    throw e;
  }
}

async function readAll(stream: Readable | null, what: string): Promise<Buffer> {
  if (!stream) throw new Error(`${what} is missing`);
  const parts: Buffer[] = [];
  for await (const chunk of stream) parts.push(chunk as Buffer);
  return Buffer.concat(parts);
}

export type OpenPack = { key: string; etag: string; index: PackIndex };

/**
 * Indexes of recently served packs, per process. A pack is written once per successful tiling
 * and served only once its micrograph is ready; a ready pyramid is never rebuilt under the same
 * key, so an index stays true for as long as its key is served. Keyed by key and ETag anyway.
 */
const CACHE_SIZE = 64;
const cache = new Map<string, OpenPack>();

/** Reads (or takes from the cache) a pack's index: two range reads, footer then index. Null when there is no pack. */
export async function openTilePack(store: ObjectStore, key: string): Promise<OpenPack | null> {
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key); // re-insert: Map order is the LRU order
    cache.set(key, hit);
    return hit;
  }
  const s = await store.stat(key);
  if (!s) return null;
  if (s.size < FOOTER_BYTES) throw new Error(`tile pack ${key} is too short`);
  const footer = await readAll(await store.read(key, { start: s.size - FOOTER_BYTES, end: s.size - 1 }), `tile pack ${key}`);
  const { indexOffset, indexLength } = decodeFooter(footer, s.size);
  const raw = await readAll(await store.read(key, { start: indexOffset, end: indexOffset + indexLength - 1 }), `tile pack ${key}`);
  const opened = { key, etag: s.etag, index: parseIndex(raw, indexOffset) };
  cache.set(key, opened);
  while (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
  return opened;
}

/** Forgets a pack's index and its hot tiles (after removing the pack), so nothing of it is served from memory. */
export function forgetTilePack(key: string): void {
  forgetTilePacksUnder(key);
}

/** Forgets every pack whose key starts with the prefix (a deleted die's tiles/<die>/). */
export function forgetTilePacksUnder(prefix: string): void {
  for (const k of [...cache.keys()]) if (k.startsWith(prefix)) cache.delete(k);
  for (const [id, b] of [...hotTiles]) {
    if (!id.startsWith(prefix)) continue;
    hotTiles.delete(id);
    hotBytes -= b.length;
  }
}

/** One tile of an opened pack as a byte range of the pack, or null when the pack has no such tile. */
export function tileRange(pack: OpenPack, tilePath: string): { start: number; end: number; length: number } | null {
  const span = Object.hasOwn(pack.index.tiles, tilePath) ? pack.index.tiles[tilePath] : undefined;
  if (!span) return null;
  return { start: span[0], end: span[0] + span[1] - 1, length: span[1] };
}

/**
 * Hot tiles of packs in an S3-compatible store, kept in memory (bounded by bytes, least recently
 * used out first). On the data dir the operating system's page cache keeps the tiles people are
 * looking at in memory; a bucket has nothing of the kind, so without this every tile of a die
 * many people pan over would be one more request to the store. Tiles never change under a pack's
 * key and ETag, so nothing here can go stale.
 */
const HOT_TILE_BYTES = 96 * 1024 ** 2;
const hotTiles = new Map<string, Buffer>();
let hotBytes = 0;

/** Opens one tile of a pack: from memory when hot (S3), else one range read of the store. */
export async function readTile(store: ObjectStore, pack: OpenPack, tilePath: string): Promise<{ body: Readable; size: number } | null> {
  const range = tileRange(pack, tilePath);
  if (!range) return null;
  if (store.kind === "local") {
    const body = await store.read(pack.key, range);
    return body ? { body, size: range.length } : null;
  }
  const id = `${pack.key}@${pack.etag}:${tilePath}`;
  let bytes = hotTiles.get(id);
  if (bytes) {
    hotTiles.delete(id);
    hotTiles.set(id, bytes);
  } else {
    const body = await store.read(pack.key, range);
    if (!body) return null;
    bytes = await readAll(body, `tile pack ${pack.key}`);
    hotTiles.set(id, bytes);
    hotBytes += bytes.length;
    while (hotBytes > HOT_TILE_BYTES) {
      const [oldest, b] = hotTiles.entries().next().value!;
      hotTiles.delete(oldest);
      hotBytes -= b.length;
    }
  }
  return { body: Readable.from([bytes]), size: bytes.length };
}
