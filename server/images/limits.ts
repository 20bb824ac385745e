import { open } from "node:fs/promises";
import os from "node:os";
import sharp, { type Metadata, type Sharp, type SharpOptions } from "sharp";
import { applyAppFontsForSvg } from "@/lib/fonts/app-fonts";
import { AppError } from "@/lib/errors";
import { MAGIC_BYTES_NEEDED, detectRasterFormat, type RasterFormat } from "@/lib/tiles/magic-bytes";

/**
 * The single place where Kerfline configures sharp. sharp's own default pixel limit
 * (268,402,689 px) is far below a stitched micrograph, so every call passes the cap
 * explicitly; an over-large header is refused before any pixel is decoded.
 */

/** Default ceiling on width × height of an input: 2.5 gigapixels. */
export const DEFAULT_PIXEL_CAP = 2_500_000_000;

/** Why an image was refused; the HTTP status follows from it. */
export type ImageRejection = "unsupported_format" | "too_many_pixels" | "damaged";

const STATUS: Record<ImageRejection, number> = { unsupported_format: 415, too_many_pixels: 413, damaged: 422 };

/** An input the tiler will not process; the message is written for the person who uploaded it. */
export class ImageRejectedError extends AppError {
  constructor(
    readonly reason: ImageRejection,
    message: string,
  ) {
    super(STATUS[reason], message, { reason });
    this.name = "ImageRejectedError";
  }
}

let configured = false;

/**
 * Sets process-wide sharp options once: one libvips thread per core this process may use
 * (glibc builds of sharp default to 1 thread).
 */
export function configureSharp(): void {
  if (configured) return;
  applyAppFontsForSvg();
  sharp.concurrency(os.availableParallelism());
  configured = true;
}

/**
 * Input options for every sharp call. `failOn: "truncated"` refuses incomplete files while
 * tolerating the harmless warnings microscope TIFFs often carry (private tags and the like).
 */
export function sharpInputOptions(pixelCap: number = DEFAULT_PIXEL_CAP): SharpOptions {
  if (!Number.isSafeInteger(pixelCap) || pixelCap < 1) throw new RangeError("pixelCap must be a positive integer");
  return { limitInputPixels: pixelCap, failOn: "truncated", sequentialRead: true };
}

/** A sharp pipeline on a file with Kerfline's input options and an explicit pixel cap. */
export function sharpInput(path: string, pixelCap: number = DEFAULT_PIXEL_CAP): Sharp {
  configureSharp();
  return sharp(path, sharpInputOptions(pixelCap));
}

/** What the header of an accepted image says. */
export type ImageProbe = { format: RasterFormat; width: number; height: number; pages?: number };

async function readMagic(path: string): Promise<Uint8Array> {
  const handle = await open(path, "r");
  try {
    const buf = Buffer.alloc(MAGIC_BYTES_NEEDED);
    const { bytesRead } = await handle.read(buf, 0, MAGIC_BYTES_NEEDED, 0);
    return buf.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

const SHARP_FORMAT: Record<RasterFormat, string> = { jpeg: "jpeg", png: "png", tiff: "tiff", bigtiff: "tiff", webp: "webp" };

function formatPixels(n: number): string {
  return `${(n / 1e9).toLocaleString("en", { maximumFractionDigits: 2 })} gigapixels`;
}

/**
 * Reads only the header of an image and refuses it (ImageRejectedError) when its content is
 * not JPEG, PNG, TIFF/BigTIFF or WebP, when width × height exceeds the cap, or when the
 * header cannot be read.
 */
export async function probeImage(path: string, pixelCap: number = DEFAULT_PIXEL_CAP): Promise<ImageProbe> {
  const format = detectRasterFormat(await readMagic(path));
  if (!format) {
    throw new ImageRejectedError("unsupported_format", "This file is not a JPEG, PNG, TIFF or WebP image.");
  }
  let meta: Metadata;
  try {
    meta = await sharpInput(path, pixelCap).metadata();
  } catch (err) {
    throw rejectionFrom(err, pixelCap);
  }
  const { width, height } = meta;
  if (!width || !height || meta.format !== SHARP_FORMAT[format]) {
    throw new ImageRejectedError("damaged", "The image header could not be read; the file may be damaged.");
  }
  if (width * height > pixelCap) throw tooLarge(width, height, pixelCap);
  return meta.pages && meta.pages > 1 ? { format, width, height, pages: meta.pages } : { format, width, height };
}

function tooLarge(width: number, height: number, pixelCap: number): ImageRejectedError {
  return new ImageRejectedError(
    "too_many_pixels",
    `The image is ${width} × ${height} px (${formatPixels(width * height)}); the limit is ${formatPixels(pixelCap)}.`,
  );
}

/**
 * Turns an error sharp raised while reading an input into an ImageRejectedError; errors that
 * are not about the input (a full disk, a missing folder) are returned unchanged.
 */
export function rejectionFrom(err: unknown, pixelCap: number = DEFAULT_PIXEL_CAP): Error {
  if (err instanceof ImageRejectedError) return err;
  const message = err instanceof Error ? err.message : String(err);
  if (/pixel limit/i.test(message)) {
    return new ImageRejectedError("too_many_pixels", `The image has more pixels than the limit of ${formatPixels(pixelCap)}.`);
  }
  if (/unsupported image format|not a known file format|is not in a known format/i.test(message)) {
    return new ImageRejectedError("unsupported_format", "This file is not a JPEG, PNG, TIFF or WebP image.");
  }
  if (/premature|truncat|corrupt|invalid|bad |read error|unexpected end|crc|out of data|not enough data/i.test(message)) {
    return new ImageRejectedError("damaged", `The image file is damaged or incomplete and cannot be read (${firstLine(message)}).`);
  }
  return err instanceof Error ? err : new Error(message);
}

function firstLine(message: string): string {
  return message.split("\n")[0].trim().slice(0, 200);
}
