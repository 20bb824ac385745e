import crypto from "node:crypto";

/**
 * A valid baseline TIFF (TIFF 6.0: header §2, IFD §2, strips §3) of any even size ≥ 70 KB,
 * generated in slices so a 1 GiB file needs no 1 GiB buffer: an 8-byte header, then filler no
 * IFD points at (TIFF allows unreferenced bytes), then one uncompressed 256 × 256 grey strip and
 * the IFD at the very end. Decoders read only the strip, so tiling it is instant whatever the
 * size; the transfer still carries every byte, which the SHA-256 comparison covers.
 */
const W = 256;
const H = 256;
const STRIP = W * H;
const ENTRIES = 9;
const IFD_BYTES = 2 + ENTRIES * 12 + 4;
const BLOCK = 1024 * 1024;

export function sparseTiff(total: number) {
  if (total % 2 || total < 8 + STRIP + IFD_BYTES + 2) throw new Error("size must be even and hold the image");
  const ifdAt = total - IFD_BYTES;
  const stripAt = ifdAt - STRIP;
  const header = Buffer.from([0x49, 0x49, 42, 0, 0, 0, 0, 0]);
  header.writeUInt32LE(ifdAt, 4);
  const strip = Buffer.alloc(STRIP);
  for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) strip[y * W + x] = (x * 3 + y * 5) & 0xff;
  const ifd = Buffer.alloc(IFD_BYTES);
  ifd.writeUInt16LE(ENTRIES, 0);
  // [tag, type (3 SHORT, 4 LONG), value]; entries in ascending tag order as §2 requires.
  const tags: [number, number, number][] = [
    [256, 3, W], // ImageWidth
    [257, 3, H], // ImageLength
    [258, 3, 8], // BitsPerSample
    [259, 3, 1], // Compression: none
    [262, 3, 1], // PhotometricInterpretation: BlackIsZero
    [273, 4, stripAt], // StripOffsets
    [277, 3, 1], // SamplesPerPixel
    [278, 3, H], // RowsPerStrip
    [279, 4, STRIP], // StripByteCounts
  ];
  tags.forEach(([tag, type, value], i) => {
    const at = 2 + i * 12;
    ifd.writeUInt16LE(tag, at);
    ifd.writeUInt16LE(type, at + 2);
    ifd.writeUInt32LE(1, at + 4);
    if (type === 3) ifd.writeUInt16LE(value, at + 8);
    else ifd.writeUInt32LE(value, at + 8);
  });
  // Filler: one random block, each copy stamped with its block number so blocks differ.
  const base = crypto.randomBytes(BLOCK);
  const fillerByte = (o: number, out: Buffer, at: number, n: number) => {
    let done = 0;
    while (done < n) {
      const p = o + done;
      const block = Math.floor(p / BLOCK);
      const within = p % BLOCK;
      const take = Math.min(n - done, BLOCK - within);
      base.copy(out, at + done, within, within + take);
      const stamp = Buffer.alloc(8);
      stamp.writeBigUInt64LE(BigInt(block));
      for (let i = within; i < Math.min(8, within + take); i++) out[at + done + i - within] = stamp[i];
      done += take;
    }
  };
  const regions: [number, number, (o: number, out: Buffer, at: number, n: number) => void][] = [
    [0, 8, (o, out, at, n) => header.copy(out, at, o, o + n)],
    [8, stripAt, fillerByte],
    [stripAt, ifdAt, (o, out, at, n) => strip.copy(out, at, o - stripAt, o - stripAt + n)],
    [ifdAt, total, (o, out, at, n) => ifd.copy(out, at, o - ifdAt, o - ifdAt + n)],
  ];
  /** The bytes [start, end) of the file. */
  const slice = (start: number, end: number): Buffer => {
    const out = Buffer.alloc(end - start);
    for (const [from, to, fill] of regions) {
      const a = Math.max(start, from);
      const b = Math.min(end, to);
      if (a < b) fill(a, out, a - start, b - a);
    }
    return out;
  };
  /** SHA-256 of the whole file (FIPS 180-4 via node:crypto), computed slice by slice. */
  const sha256 = () => {
    const h = crypto.createHash("sha256");
    for (let o = 0; o < total; o += 8 * BLOCK) h.update(slice(o, Math.min(total, o + 8 * BLOCK)));
    return h.digest("hex");
  };
  return { size: total, width: W, height: H, slice, sha256 };
}
