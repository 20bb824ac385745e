import "server-only";
import sharp from "sharp";
import { resampleArea, scaledSize } from "@/lib/find-similar/raster";
import type { Gray, PixelSource, PxBox } from "@/lib/find-similar/types";
import { levelTiles, tilePath, type PyramidDescription } from "@/lib/tiles/iiif";
import { localCopy, objectStore } from "@/server/storage";
import type { ObjectStore } from "@/server/storage/object-store";
import { micrographKeys } from "@/server/storage/keys";
import { openTilePack, readTile, type OpenPack } from "@/server/storage/tile-pack";
import { configureSharp, DEFAULT_PIXEL_CAP } from "../limits";

export type { PixelSource } from "@/lib/find-similar/types";

/**
 * A micrograph's pixels for the template search and die-edge detection, read a region at a time
 * with bounded memory. From the stored pyramid when there is one: a read at scale ≤ 1 takes the
 * finest level no finer than it needs (so a whole-image pass at 1/8 decodes 1/64 of the pixels)
 * and decodes only the tiles under the box, keeping recently decoded tiles in a small cache.
 * Without a pyramid, from the original through sharp (libvips streams and shrinks on load).
 */

/** Decoded tiles kept per source (bytes of 8-bit grey), enough for a refinement pass's neighbourhoods. */
const TILE_CACHE_BYTES = 64 * 1024 ** 2;

async function toBuffer(body: NodeJS.ReadableStream): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const chunk of body) parts.push(chunk as Buffer);
  return Buffer.concat(parts);
}

type DecodedTile = { data: Uint8Array; width: number; height: number };

/** Reads regions from a tile pack's levels. */
function tilePackPixels(store: ObjectStore, pack: OpenPack): PixelSource {
  const p: PyramidDescription = pack.index.pyramid;
  const cache = new Map<string, DecodedTile>();
  let cached = 0;
  async function tile(path: string): Promise<DecodedTile> {
    const hit = cache.get(path);
    if (hit) {
      cache.delete(path);
      cache.set(path, hit);
      return hit;
    }
    const found = (await readTile(store, pack, path)) ?? null;
    if (!found) throw new Error(`tile ${path} is missing from the pyramid`);
    const { data, info } = await sharp(await toBuffer(found.body))
      .greyscale()
      .raw()
      .toBuffer({ resolveWithObject: true });
    const t = { data: new Uint8Array(data.buffer, data.byteOffset, data.length), width: info.width, height: info.height };
    cache.set(path, t);
    cached += t.data.length;
    while (cached > TILE_CACHE_BYTES && cache.size > 1) {
      const [k, v] = cache.entries().next().value!;
      cache.delete(k);
      cached -= v.data.length;
    }
    return t;
  }
  // sharp writes the whole-image tile as "full/…", the older vips CLI with its coordinates.
  const wholeRegion = Object.keys(pack.index.tiles).some((k) => k.startsWith("full/")) ? "full" : "coordinates";
  return {
    width: p.width,
    height: p.height,
    async read(box: PxBox, scale: number): Promise<Gray> {
      const [outW, outH] = scaledSize(box, scale);
      // The coarsest level still at least as fine as the read (small tolerance for rounding).
      const s = [...p.scaleFactors].filter((f) => f <= 1 / scale + 1e-9).pop() ?? 1;
      const lw = Math.ceil(p.width / s);
      const lh = Math.ceil(p.height / s);
      const ix0 = Math.max(0, Math.floor(box.x / s));
      const iy0 = Math.max(0, Math.floor(box.y / s));
      const ix1 = Math.min(lw, Math.ceil((box.x + box.w) / s));
      const iy1 = Math.min(lh, Math.ceil((box.y + box.h) / s));
      const aw = ix1 - ix0;
      const ah = iy1 - iy0;
      const area = new Float32Array(aw * ah);
      const T = p.tileSize;
      for (const t of levelTiles(p.width, p.height, T, s)) {
        const tx = t.region.x / s;
        const ty = t.region.y / s;
        if (tx >= ix1 || ty >= iy1 || tx + t.size.w <= ix0 || ty + t.size.h <= iy0) continue;
        const d = await tile(tilePath(t, p.width, p.height, wholeRegion));
        const x0 = Math.max(ix0, tx);
        const x1 = Math.min(ix1, tx + d.width);
        for (let y = Math.max(iy0, ty); y < Math.min(iy1, ty + d.height); y++) {
          const srcRow = (y - ty) * d.width;
          const dstRow = (y - iy0) * aw;
          for (let x = x0; x < x1; x++) area[dstRow + x - ix0] = d.data[srcRow + x - tx];
        }
      }
      return resampleArea({ width: aw, height: ah, data: area }, box.x / s - ix0, box.y / s - iy0, box.w / s, box.h / s, outW, outH);
    },
  };
}

/** Reads regions of an image file through sharp: reduced reads shrink the whole image on load first. */
function filePixels(file: string, width: number, height: number): PixelSource {
  return {
    width,
    height,
    async read(box: PxBox, scale: number): Promise<Gray> {
      const [outW, outH] = scaledSize(box, scale);
      // Whole-image reduction (libvips shrinks JPEG on load), then the covering integer region.
      const rw = Math.max(1, Math.round(width * scale));
      const rh = Math.max(1, Math.round(height * scale));
      const [sx, sy] = [rw / width, rh / height];
      const left = Math.max(0, Math.floor(box.x * sx));
      const top = Math.max(0, Math.floor(box.y * sy));
      const right = Math.min(rw, Math.ceil((box.x + box.w) * sx));
      const bottom = Math.min(rh, Math.ceil((box.y + box.h) * sy));
      let img = sharp(file, { limitInputPixels: DEFAULT_PIXEL_CAP });
      if (rw !== width || rh !== height) img = img.resize(rw, rh, { fit: "fill" });
      const { data, info } = await img
        .extract({ left, top, width: right - left, height: bottom - top })
        .greyscale()
        .raw()
        .toBuffer({ resolveWithObject: true });
      const area = { width: info.width, height: info.height, data: Float32Array.from(data.subarray(0, info.width * info.height)) };
      return resampleArea(area, box.x * sx - left, box.y * sy - top, box.w * sx, box.h * sy, outW, outH);
    },
  };
}

/**
 * A micrograph's pixels: its stored pyramid when tiled, else its original. Call close() when done
 * (it releases a downloaded copy of the original).
 */
export async function micrographPixels(m: {
  dieId: string;
  id: string;
  format: string | null;
  width: number;
  height: number;
}): Promise<PixelSource & { close(): Promise<void> }> {
  configureSharp();
  const store = objectStore();
  const keys = micrographKeys(m.dieId, m.id, m.format);
  const pack = await openTilePack(store, keys.pack);
  if (pack) return { ...tilePackPixels(store, pack), close: async () => {} };
  const local = keys.original ? await localCopy(keys.original) : null;
  if (!local) throw new Error(`micrograph ${m.id} has no stored pixels`);
  return { ...filePixels(local.path, m.width, m.height), close: () => local.release() };
}
