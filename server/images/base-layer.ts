import path from "node:path";
import sharp, { type Sharp } from "sharp";
import { configureSharp, sharpInput } from "@/server/images/limits";
import type { RenderPlan } from "@/lib/export/render-plan";

/**
 * Stage one of an export: the image area (output width × image height, no footer) resampled
 * from the original through the micrograph's transform. It is written once to an uncompressed
 * tiled TIFF (or held in memory for small renders) so that the drawing stage reads it with
 * random access: libvips' compositing and affine both ask for regions out of order, which on
 * a sequentially decoded JPEG or TIFF would mean decoding parts of it again and again.
 */

export const BACKGROUND = { r: 40, g: 44, b: 48 };

/** Where intermediate rasters go: files beside the output, or memory when `dir` is null. */
export type Scratch = { readonly dir: string | null; readonly stem: string; readonly files: string[] };

/** Runs a pipeline to its end and reopens the result for random access. */
async function materialise(p: Sharp, scratch: Scratch, tag: string): Promise<Sharp> {
  if (!scratch.dir) {
    const { data, info } = await p.raw().toBuffer({ resolveWithObject: true });
    return sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels }, limitInputPixels: false });
  }
  // An uncompressed tiled TIFF: random access through a small tile cache, read with read(2).
  // (libvips' own .v format would be memory-mapped, and every page read would count as ours.)
  const file = path.join(scratch.dir, `${scratch.stem}-${tag}.tif`);
  scratch.files.push(file);
  await p.tiff({ compression: "none", tile: true, tileWidth: 256, tileHeight: 256 }).toFile(file);
  return sharp(file, { limitInputPixels: false });
}

type Placement = { readonly outLeft: number; readonly outTop: number; readonly outWidth: number; readonly outHeight: number };

/** Trims and pads an image of `outWidth` × `outHeight` placed at (outLeft, outTop) onto a W × H canvas. */
function place(img: Sharp, at: Placement, W: number, H: number): Sharp {
  const cropLeft = Math.max(0, -at.outLeft);
  const cropTop = Math.max(0, -at.outTop);
  const placeLeft = Math.max(0, at.outLeft);
  const placeTop = Math.max(0, at.outTop);
  const visW = Math.min(at.outWidth - cropLeft, W - placeLeft);
  const visH = Math.min(at.outHeight - cropTop, H - placeTop);
  if (visW < 1 || visH < 1) return blank(W, H);
  if (cropLeft || cropTop || visW !== at.outWidth || visH !== at.outHeight) img = img.extract({ left: cropLeft, top: cropTop, width: visW, height: visH });
  return img.extend({ left: placeLeft, top: placeTop, right: W - placeLeft - visW, bottom: H - placeTop - visH, background: BACKGROUND });
}

/** A plain canvas in the background colour. */
export function blank(W: number, H: number): Sharp {
  configureSharp();
  return sharp({ create: { width: W, height: H, channels: 3, background: BACKGROUND } });
}

/** The source window as 8-bit sRGB without alpha, whatever the micrograph's format. */
function sourceWindow(original: string, pixelCap: number, w: { left: number; top: number; width: number; height: number }): Sharp {
  return sharpInput(original, pixelCap)
    .extract({ left: w.left, top: w.top, width: w.width, height: w.height })
    .flatten({ background: BACKGROUND })
    .toColourspace("srgb");
}

/** The export's image area as a random-access raster of plan.width × plan.height, 3 bands. */
export async function baseLayer(original: string | null, pixelCap: number, plan: RenderPlan, scratch: Scratch): Promise<Sharp> {
  const s = plan.source;
  const W = plan.width;
  const H = plan.height;
  if (!s || !original) return blank(W, H);
  if (s.kind === "axis") {
    let img = sourceWindow(original, pixelCap, s);
    if (s.flop) img = img.flop();
    if (s.flip) img = img.flip();
    img = img.resize(s.outWidth, s.outHeight, { fit: "fill", kernel: "lanczos3" });
    return materialise(place(img, s, W, H), scratch, "image");
  }
  // Rotated or sheared: shrink with the resampling filters first, then the small residual affine.
  let img = sourceWindow(original, pixelCap, s);
  if (s.resizedWidth !== s.width || s.resizedHeight !== s.height) img = img.resize(s.resizedWidth, s.resizedHeight, { fit: "fill", kernel: "lanczos3" });
  const resized = await materialise(img, scratch, "window");
  // sharp crops and pads before its affine step, so the turned image is written out before placing it.
  const turned = await materialise(
    resized.affine([...s.matrix] as [number, number, number, number], {
      odx: s.odx,
      ody: s.ody,
      background: BACKGROUND,
      interpolator: sharp.interpolators.bicubic,
    }),
    scratch,
    "turned",
  );
  return materialise(place(turned, s, W, H), scratch, "image");
}
