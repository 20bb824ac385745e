/**
 * The IIIF Image API 3.0 tile algorithm for a static (level 0) pyramid: which tiles exist for
 * a W×H image, what the `info.json` says about them, and which tile requests are valid.
 *
 * The file set is the one libvips' `dzsave --layout iiif3` writes: scale factors 1, 2, 4, …
 * down to the first level where the whole image fits one tile; each tile's region and size
 * follow the implementation notes of the Image API 3.0; sizes are written as `w,h`. The level
 * that covers the whole image is written with the region `full` by the libvips inside sharp
 * (8.18) and as `0,0,W,H` by the older Debian CLI (8.14); both spellings are supported.
 */

const IIIF_IMAGE_CONTEXT = "http://iiif.io/api/image/3/context.json";
const IIIF_IMAGE_PROTOCOL = "http://iiif.io/api/image";
export const DEFAULT_TILE_SIZE = 512;

/** A region of the full-resolution image in pixels. */
type TileRegion = { readonly x: number; readonly y: number; readonly w: number; readonly h: number };
/** The pixel size a region is delivered at. */
type TileSize = { readonly w: number; readonly h: number };

/** One tile of the pyramid: its scale factor, region and delivered size. */
export type Tile = { readonly scaleFactor: number; readonly region: TileRegion; readonly size: TileSize };

/** A parsed tile request: canonical numbers, or the keywords `full` and `max`. */
export type TileRequest = { readonly region: TileRegion | "full"; readonly size: TileSize | "max" };

/** What a served pyramid needs to know about itself (stored as `pyramid.json`). */
export type PyramidDescription = {
  readonly width: number;
  readonly height: number;
  readonly tileSize: number;
  readonly scaleFactors: readonly number[];
};

/** How the whole-image level's region is spelled in paths. */
export type WholeImageRegion = "full" | "coordinates";

/** The `info.json` document of a level 0 image service. */
export type IiifInfo = {
  readonly "@context": typeof IIIF_IMAGE_CONTEXT;
  readonly id: string;
  readonly type: "ImageService3";
  readonly protocol: typeof IIIF_IMAGE_PROTOCOL;
  readonly profile: "level0";
  readonly width: number;
  readonly height: number;
  readonly tiles: readonly { readonly width: number; readonly height: number; readonly scaleFactors: readonly number[] }[];
};

function assertPositiveInt(value: number, what: string): void {
  if (!Number.isSafeInteger(value) || value < 1) throw new RangeError(`${what} must be a positive integer`);
}

/**
 * Scale factors 1, 2, 4, … up to and including the first one at which the whole image fits
 * in a single tile (a 1×1 image or one no larger than the tile has just [1]).
 */
export function scaleFactors(width: number, height: number, tileSize = DEFAULT_TILE_SIZE): number[] {
  assertPositiveInt(width, "width");
  assertPositiveInt(height, "height");
  assertPositiveInt(tileSize, "tileSize");
  const factors = [1];
  let s = 1;
  while (Math.ceil(width / s) > tileSize || Math.ceil(height / s) > tileSize) {
    s *= 2;
    factors.push(s);
  }
  return factors;
}

/**
 * The tiles of one level, row by row: for column n and row m, region x = n·tw·s,
 * y = m·th·s, w = min(tw·s, W − x), h = min(th·s, H − y); size = ceil(region / s).
 */
export function levelTiles(width: number, height: number, tileSize: number, scaleFactor: number): Tile[] {
  assertPositiveInt(scaleFactor, "scaleFactor");
  const span = tileSize * scaleFactor;
  const tiles: Tile[] = [];
  for (let y = 0; y < height; y += span) {
    for (let x = 0; x < width; x += span) {
      const w = Math.min(span, width - x);
      const h = Math.min(span, height - y);
      tiles.push({
        scaleFactor,
        region: { x, y, w, h },
        size: { w: Math.ceil(w / scaleFactor), h: Math.ceil(h / scaleFactor) },
      });
    }
  }
  return tiles;
}

/** The path of one tile below the pyramid folder: `{region}/{w},{h}/0/default.jpg`. */
export function tilePath(tile: Pick<Tile, "region" | "size">, width: number, height: number, wholeImageRegion: WholeImageRegion = "full"): string {
  const { x, y, w, h } = tile.region;
  const whole = x === 0 && y === 0 && w === width && h === height;
  const region = whole && wholeImageRegion === "full" ? "full" : `${x},${y},${w},${h}`;
  return `${region}/${tile.size.w},${tile.size.h}/0/default.jpg`;
}

/**
 * Every distinct tile path of the pyramid, finest level first. A 1-px edge tile can be the
 * same region and size at two levels (e.g. 2048,1024,1,1/1,1 of a 2049×1025 image) and is
 * one file. `wholeImageRegion` picks the spelling of the single whole-image tile ("full" as
 * sharp writes it, "coordinates" as vips 8.14 does).
 */
export function expectedTilePaths(width: number, height: number, tileSize = DEFAULT_TILE_SIZE, wholeImageRegion: WholeImageRegion = "full"): string[] {
  const paths = scaleFactors(width, height, tileSize).flatMap((s) =>
    levelTiles(width, height, tileSize, s).map((t) => tilePath(t, width, height, wholeImageRegion)),
  );
  return [...new Set(paths)];
}

/** The number of distinct region folders at the top of the pyramid (cheap progress measure). */
export function expectedRegionCount(width: number, height: number, tileSize = DEFAULT_TILE_SIZE): number {
  return new Set(expectedTilePaths(width, height, tileSize).map((p) => p.slice(0, p.indexOf("/")))).size;
}

/**
 * The `info.json` of a level 0 image service with square tiles. Throws when the scale
 * factors are not distinct positive integers (the Image API requires that).
 */
export function buildInfoJson(input: { id: string } & PyramidDescription): IiifInfo {
  const { id, width, height, tileSize } = input;
  assertPositiveInt(width, "width");
  assertPositiveInt(height, "height");
  assertPositiveInt(tileSize, "tileSize");
  input.scaleFactors.forEach((s) => assertPositiveInt(s, "scale factor"));
  if (new Set(input.scaleFactors).size !== input.scaleFactors.length) throw new RangeError("scale factors must be distinct");
  return {
    "@context": IIIF_IMAGE_CONTEXT,
    id,
    type: "ImageService3",
    protocol: IIIF_IMAGE_PROTOCOL,
    profile: "level0",
    width,
    height,
    tiles: [{ width: tileSize, height: tileSize, scaleFactors: [...input.scaleFactors] }],
  };
}

// Canonical integers: no sign, no leading zeros, at most 9 digits (well above any image side).
const NON_NEGATIVE = "(0|[1-9][0-9]{0,8})";
const POSITIVE = "([1-9][0-9]{0,8})";
const REGION_RE = new RegExp(`^${NON_NEGATIVE},${NON_NEGATIVE},${POSITIVE},${POSITIVE}$`);
const SIZE_RE = new RegExp(`^${POSITIVE},${POSITIVE}$`);

/**
 * Parses the region and size segments of a tile URL. Only canonical forms are accepted:
 * `x,y,w,h` or `full` for the region, `w,h` or `max` for the size. Everything else —
 * percent-escapes, dots, signs, spaces, leading zeros, zero sizes, `pct:`, `!w,h`, `^` — gives
 * null, so a parsed request can only ever name a path built from integers.
 */
export function parseTileRequest(region: string, size: string): TileRequest | null {
  if (typeof region !== "string" || typeof size !== "string") return null;
  let parsedRegion: TileRegion | "full";
  if (region === "full") parsedRegion = "full";
  else {
    const m = REGION_RE.exec(region);
    if (!m) return null;
    parsedRegion = { x: Number(m[1]), y: Number(m[2]), w: Number(m[3]), h: Number(m[4]) };
  }
  let parsedSize: TileSize | "max";
  if (size === "max") parsedSize = "max";
  else {
    const m = SIZE_RE.exec(size);
    if (!m) return null;
    parsedSize = { w: Number(m[1]), h: Number(m[2]) };
  }
  return { region: parsedRegion, size: parsedSize };
}

function sameSize(a: TileSize, b: TileSize): boolean {
  return a.w === b.w && a.h === b.h;
}

/** The scale factor at which `region` is exactly one tile of the pyramid, given its size. */
function matchRegion(p: PyramidDescription, r: TileRegion, size: TileSize): number | null {
  for (const s of p.scaleFactors) {
    const span = p.tileSize * s;
    if (r.x % span !== 0 || r.y % span !== 0 || r.x >= p.width || r.y >= p.height) continue;
    if (r.w !== Math.min(span, p.width - r.x) || r.h !== Math.min(span, p.height - r.y)) continue;
    if (sameSize(size, { w: Math.ceil(r.w / s), h: Math.ceil(r.h / s) })) return s;
  }
  return null;
}

/**
 * The stored file (relative to the pyramid folder, in sharp's spelling) that answers a
 * parsed request, or null when the pyramid has no such tile. `full` is the whole image at
 * the coarsest level; `max` is only the full-resolution size of a whole-image tile.
 */
export function resolveTilePath(request: TileRequest, pyramid: PyramidDescription): string | null {
  const { width, height } = pyramid;
  // `max` is canonical only for the whole image; a tile region with `max` is refused.
  if (request.size === "max" && request.region !== "full") return null;
  const region = request.region === "full" ? { x: 0, y: 0, w: width, h: height } : request.region;
  const size = request.size === "max" ? { w: region.w, h: region.h } : request.size;
  const s = matchRegion(pyramid, region, size);
  if (s === null) return null;
  // `full/max` exists only when the whole image fits one tile at full resolution.
  if (request.size === "max" && s !== 1) return null;
  return tilePath({ region, size }, width, height, "full");
}
