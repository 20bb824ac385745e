/**
 * Recognises the raster formats Kerfline accepts from the first bytes of a file, so that an
 * upload is classified by its content and never by its name or the browser's MIME type.
 * Anything else (SVG, HTML, text, GIF, PDF…) is refused: SVG in particular can reference
 * other files and run a second parser, so it must never reach the image decoder.
 */

export type RasterFormat = "jpeg" | "png" | "tiff" | "bigtiff" | "webp";

/** How many leading bytes `detectRasterFormat` needs to decide. */
export const MAGIC_BYTES_NEEDED = 16;

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function startsWith(bytes: Uint8Array, expected: readonly number[], at = 0): boolean {
  if (bytes.length < at + expected.length) return false;
  return expected.every((b, i) => bytes[at + i] === b);
}

function ascii(bytes: Uint8Array, at: number, text: string): boolean {
  return startsWith(
    bytes,
    Array.from(text, (c) => c.charCodeAt(0)),
    at,
  );
}

/**
 * TIFF header (TIFF 6.0 §2): byte order "II" or "MM", then the version 42; BigTIFF uses
 * version 43 followed by the offset size 8 and a zero word.
 */
function detectTiff(bytes: Uint8Array): "tiff" | "bigtiff" | null {
  if (bytes.length < 8) return null;
  const little = bytes[0] === 0x49 && bytes[1] === 0x49;
  const big = bytes[0] === 0x4d && bytes[1] === 0x4d;
  if (!little && !big) return null;
  const word = (i: number) => (little ? bytes[i] | (bytes[i + 1] << 8) : (bytes[i] << 8) | bytes[i + 1]);
  const version = word(2);
  if (version === 42) return "tiff";
  if (version === 43 && word(4) === 8 && word(6) === 0) return "bigtiff";
  return null;
}

/**
 * Returns the raster format the bytes start with, or null for anything Kerfline does not
 * accept. Pass at least `MAGIC_BYTES_NEEDED` bytes.
 */
export function detectRasterFormat(bytes: Uint8Array): RasterFormat | null {
  // JPEG: SOI marker followed by the start of the next marker (JPEG, ITU-T T.81 Annex B).
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "jpeg";
  if (startsWith(bytes, PNG_SIGNATURE)) return "png";
  const tiff = detectTiff(bytes);
  if (tiff) return tiff;
  // WebP: a RIFF container whose form type is "WEBP" (RIFF header, then 4-byte size).
  if (ascii(bytes, 0, "RIFF") && ascii(bytes, 8, "WEBP")) return "webp";
  return null;
}
