import type { PyramidDescription } from "./iiif";

/**
 * The tile pack: one micrograph's whole IIIF pyramid as one object, read by byte ranges.
 *
 *   [tile JPEG][tile JPEG]…[index JSON][footer, 24 bytes]
 *
 * The index maps each tile's path (sharp's IIIF 3 folder spelling, relative, '/'-separated) to
 * [offset, length] in the pack, and carries the pyramid's description. The footer is the magic
 * "KFTPACK1" then the index's offset and length as unsigned 64-bit big-endian integers, so a
 * reader needs two range reads (footer, index) before it can serve any tile with one more.
 * Our own layout: no packaged format is "an IIIF pyramid in one range-readable object".
 */
const PACK_MAGIC = "KFTPACK1";
export const FOOTER_BYTES = 24;
/** An index larger than this is refused: a 100,000 × 100,000 px pyramid's is about 3 MB. */
const MAX_INDEX_BYTES = 64 * 1024 * 1024;

export type PackIndex = {
  readonly version: 1;
  readonly pyramid: PyramidDescription;
  readonly tiles: Readonly<Record<string, readonly [offset: number, length: number]>>;
};

export function encodeFooter(indexOffset: number, indexLength: number): Buffer {
  const b = Buffer.alloc(FOOTER_BYTES);
  b.write(PACK_MAGIC, 0, "latin1");
  b.writeBigUInt64BE(BigInt(indexOffset), 8);
  b.writeBigUInt64BE(BigInt(indexLength), 16);
  return b;
}

/** Reads the footer of a pack of `packSize` bytes; throws on anything that is not one. */
export function decodeFooter(footer: Buffer, packSize: number): { indexOffset: number; indexLength: number } {
  if (footer.length !== FOOTER_BYTES || footer.toString("latin1", 0, 8) !== PACK_MAGIC) throw new Error("not a tile pack (bad footer)");
  const indexOffset = Number(footer.readBigUInt64BE(8));
  const indexLength = Number(footer.readBigUInt64BE(16));
  if (indexLength < 2 || indexLength > MAX_INDEX_BYTES || indexOffset + indexLength + FOOTER_BYTES !== packSize)
    throw new Error("tile pack footer points outside the pack");
  return { indexOffset, indexLength };
}

const positiveInt = (n: unknown) => Number.isSafeInteger(n) && (n as number) > 0;

/** Parses and checks an index: every tile lies inside the tile area before the index. */
export function parseIndex(raw: Buffer, indexOffset: number): PackIndex {
  const v = JSON.parse(raw.toString("utf8")) as Partial<PackIndex>;
  const p = v.pyramid as Partial<PyramidDescription> | undefined;
  const pyramidOk =
    !!p &&
    [p.width, p.height, p.tileSize].every(positiveInt) &&
    Array.isArray(p.scaleFactors) &&
    p.scaleFactors.length > 0 &&
    p.scaleFactors.every(positiveInt);
  if (v.version !== 1 || !pyramidOk || !v.tiles || typeof v.tiles !== "object") throw new Error("tile pack index is malformed");
  for (const [name, span] of Object.entries(v.tiles)) {
    const ok =
      Array.isArray(span) && span.length === 2 && Number.isSafeInteger(span[0]) && span[0] >= 0 && positiveInt(span[1]) && span[0] + span[1] <= indexOffset;
    if (!ok) throw new Error(`tile pack index entry ${name} is out of range`);
  }
  return v as PackIndex;
}
