import "server-only";

/**
 * Keys of every stored object, built only from server-made UUIDs and fixed names, never from
 * client input. Each area keeps a die's objects below `<area>/<dieId>/`, so deleting a die is
 * one prefix removal per area:
 *   originals/<dieId>/<micrographId>.<ext>        the uploaded file
 *   tiles/<dieId>/<micrographId>.tilepack         the IIIF pyramid in one object (tile-pack.ts)
 *   tiles/<dieId>/<micrographId>-preview.jpg      made first, shown while tiling
 *   tiles/<dieId>/<micrographId>-thumb.jpg        made last
 *   exports/<dieId>/<exportId>.png                a rendered export
 *   mosaics/<dieId>/<micrographId>/<n>.<ext>      frame n (0-based, capture order) of a mosaic
 */
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const checkId = (id: string) => {
  if (!UUID.test(id)) throw new Error(`not a UUID: ${id}`);
  return id.toLowerCase();
};

const EXTENSION = { jpeg: "jpg", png: "png", tiff: "tif", bigtiff: "tif", webp: "webp" } as const;
type StoredFormat = keyof typeof EXTENSION;

const AREAS = ["originals", "tiles", "exports", "mosaics"] as const;

/** The keys of one micrograph's objects; `original` is null while its format is unknown. */
export function micrographKeys(dieId: string, micrographId: string, format?: string | null) {
  const die = checkId(dieId);
  const id = checkId(micrographId);
  const ext = format && format in EXTENSION ? EXTENSION[format as StoredFormat] : null;
  return {
    original: ext ? `originals/${die}/${id}.${ext}` : null,
    pack: `tiles/${die}/${id}.tilepack`,
    preview: `tiles/${die}/${id}-preview.jpg`,
    thumbnail: `tiles/${die}/${id}-thumb.jpg`,
  };
}

/** Every object a micrograph owns once tiled (the original last: a retry needs it). */
export function derivedKeys(dieId: string, micrographId: string): string[] {
  const k = micrographKeys(dieId, micrographId);
  return [k.pack, k.preview, k.thumbnail];
}

/** The folder of a mosaic's stored frames: one prefix, so deleting the micrograph removes them all. */
export const mosaicFramesPrefix = (dieId: string, micrographId: string) => `mosaics/${checkId(dieId)}/${checkId(micrographId)}/`;

/** Frame `index` (0-based, capture order) of a mosaic, stored in its own format. */
export function mosaicFrameKey(dieId: string, micrographId: string, index: number, format: string): string {
  if (!(format in EXTENSION) || !Number.isInteger(index) || index < 0) throw new Error(`not a frame: ${index}.${format}`);
  return `${mosaicFramesPrefix(dieId, micrographId)}${index}.${EXTENSION[format as StoredFormat]}`;
}

export const exportKey = (dieId: string, exportId: string) => `exports/${checkId(dieId)}/${checkId(exportId)}.png`;

/** The prefixes holding everything of one die. */
export const diePrefixes = (dieId: string) => AREAS.map((area) => `${area}/${checkId(dieId)}/`);
