import { crc32 } from "node:zlib";

/**
 * PNG text chunks (PNG specification, 3rd ed., §11.3.3.3 tEXt / 2nd ed. §11.3.4.3): keyword of
 * 1–79 Latin-1 characters, a NUL, then Latin-1 text. sharp writes no text chunks of its own,
 * so they are spliced in after IHDR, each with its CRC-32 over type and data (§5.3).
 */

/** Characters outside Latin-1 cannot be stored in tEXt; they become "?". */
function latin1(text: string): Buffer {
  return Buffer.from(text.replace(/[^\u0000-\u00ff]/g, "?"), "latin1");
}

/**
 * One text chunk: tEXt (keyword NUL Latin-1 text) when the text is plain ASCII, else iTXt
 * (§11.3.3.4: keyword NUL, compression flag 0, method 0, empty language NUL, empty translated
 * keyword NUL, UTF-8 text), since readers differ on how they decode Latin-1 bytes above 127.
 */
export function textChunk(keyword: string, text: string): Buffer {
  if (!/^[\x20-\x7e\xa1-\xff]{1,79}$/.test(keyword) || /^ | $|  /.test(keyword)) throw new RangeError(`not a valid PNG keyword: ${keyword}`);
  const clean = text.replace(/\0/g, "");
  const ascii = /^[\x00-\x7f]*$/.test(clean);
  const data = ascii
    ? Buffer.concat([latin1(keyword), Buffer.from([0]), latin1(clean)])
    : Buffer.concat([latin1(keyword), Buffer.from([0, 0, 0, 0, 0]), Buffer.from(clean, "utf8")]);
  const typed = Buffer.concat([Buffer.from(ascii ? "tEXt" : "iTXt", "ascii"), data]);
  const head = Buffer.alloc(4);
  head.writeUInt32BE(data.length);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed) >>> 0);
  return Buffer.concat([head, typed, crc]);
}
