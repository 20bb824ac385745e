/**
 * The header of an uncompressed, strip-organised BigTIFF (8-bit grey or RGB, chunky), written
 * before its pixels so that the pixels can then be appended strip after strip without ever
 * holding the image in memory. Layout per the BigTIFF extension of TIFF 6.0 (header "II", 43,
 * offset size 8; IFD entries of 20 bytes with 8-byte counts and values).
 */
export type StripTiff = { width: number; height: number; channels: 1 | 3; rowsPerStrip: number };

const SHORT = 3;
const LONG = 4;
const LONG8 = 16;

/** The bytes that precede the first pixel; the pixels follow row by row. */
export function bigTiffHeader({ width, height, channels, rowsPerStrip }: StripTiff): Buffer {
  const strips = Math.ceil(height / rowsPerStrip);
  const stripBytes = (k: number) => Math.min(rowsPerStrip, height - k * rowsPerStrip) * width * channels;
  type Entry = { tag: number; type: number; values: number[] };
  const entries: Entry[] = [
    { tag: 256, type: LONG, values: [width] },
    { tag: 257, type: LONG, values: [height] },
    { tag: 258, type: SHORT, values: Array(channels).fill(8) },
    { tag: 259, type: SHORT, values: [1] },
    { tag: 262, type: SHORT, values: [channels === 3 ? 2 : 1] },
    { tag: 273, type: LONG8, values: [] },
    { tag: 277, type: SHORT, values: [channels] },
    { tag: 278, type: LONG, values: [rowsPerStrip] },
    { tag: 279, type: LONG8, values: Array.from({ length: strips }, (_, k) => stripBytes(k)) },
    { tag: 284, type: SHORT, values: [1] },
  ];
  const size = { [SHORT]: 2, [LONG]: 4, [LONG8]: 8 } as Record<number, number>;
  const ifdAt = 16;
  const ifdBytes = 8 + entries.length * 20 + 8;
  // Arrays too long for the 8-byte value field go after the IFD: offsets, then byte counts.
  const offsetsAt = ifdAt + ifdBytes;
  const countsAt = offsetsAt + strips * 8;
  const dataAt = Math.ceil((countsAt + strips * 8) / 16) * 16;
  entries[5].values = Array.from({ length: strips }, (_, k) => dataAt + k * rowsPerStrip * width * channels);
  const buf = Buffer.alloc(dataAt);
  buf.write("II", 0, "latin1");
  buf.writeUInt16LE(43, 2);
  buf.writeUInt16LE(8, 4);
  buf.writeUInt16LE(0, 6);
  buf.writeBigUInt64LE(BigInt(ifdAt), 8);
  buf.writeBigUInt64LE(BigInt(entries.length), ifdAt);
  const put = (at: number, type: number, v: number) => {
    if (type === SHORT) buf.writeUInt16LE(v, at);
    else if (type === LONG) buf.writeUInt32LE(v, at);
    else buf.writeBigUInt64LE(BigInt(v), at);
  };
  entries.forEach((e, i) => {
    const at = ifdAt + 8 + i * 20;
    buf.writeUInt16LE(e.tag, at);
    buf.writeUInt16LE(e.type, at + 2);
    buf.writeBigUInt64LE(BigInt(e.values.length), at + 4);
    const bytes = e.values.length * size[e.type];
    const base = bytes <= 8 ? at + 12 : e.tag === 273 ? offsetsAt : countsAt;
    if (bytes > 8) buf.writeBigUInt64LE(BigInt(base), at + 12);
    e.values.forEach((v, k) => put(base + k * size[e.type], e.type, v));
  });
  buf.writeBigUInt64LE(0n, ifdAt + 8 + entries.length * 20);
  return buf;
}
