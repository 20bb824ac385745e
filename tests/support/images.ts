// Test images made on the spot with sharp (and by hand where a file must be malformed).
import sharp from "sharp";
import { crc32, deflateSync } from "node:zlib";

/** A noisy-ish RGB JPEG of the given size (gradients plus a grid, so tiles differ). */
export async function makeJpeg(width: number, height: number, quality = 85): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">
    <defs><linearGradient id="g" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="#6a7b5a"/><stop offset="1" stop-color="#c9b36b"/></linearGradient>
    <pattern id="p" width="97" height="89" patternUnits="userSpaceOnUse"><rect width="60" height="40" x="10" y="10" fill="#e8d9a0"/></pattern></defs>
    <rect width="100%" height="100%" fill="url(#g)"/><rect width="100%" height="100%" fill="url(#p)" opacity="0.6"/></svg>`;
  return sharp(Buffer.from(svg), { limitInputPixels: false }).jpeg({ quality }).toBuffer();
}

export async function makePng(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 90, g: 110, b: 80 } }, limitInputPixels: false })
    .png()
    .toBuffer();
}

function pngChunk(type: string, body: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(body.length);
  const typed = Buffer.concat([Buffer.from(type, "ascii"), body]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([length, typed, crc]);
}

/** A complete, tiny PNG whose IHDR declares width × height (PNG spec §11.2.2): a decompression bomb's header. */
export function pngDeclaring(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // RGB
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, pngChunk("IHDR", ihdr), pngChunk("IDAT", deflateSync(Buffer.alloc(64))), pngChunk("IEND", Buffer.alloc(0))]);
}

/** Multipart body for an upload, built by the platform's FormData. */
export function uploadForm(file: Buffer | string | null, fileName: string, fields: Record<string, string> = {}, type = "application/octet-stream"): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  if (file !== null) form.append("file", new Blob([typeof file === "string" ? Buffer.from(file) : new Uint8Array(file)], { type }), fileName);
  return form;
}
