import { randomBytes } from "node:crypto";
import { mkdir, readFile, readdir, rename, rm, stat, writeFile } from "node:fs/promises";
import path from "node:path";
import { DEFAULT_TILE_SIZE, expectedRegionCount, scaleFactors, tilePath, type PyramidDescription } from "@/lib/tiles/iiif";
import { DEFAULT_PIXEL_CAP, probeImage, rejectionFrom, sharpInput } from "./limits";

/**
 * Builds the deep-zoom pyramid (IIIF Image API 3.0, level 0, JPEG tiles) of one micrograph
 * with sharp, plus the preview and thumbnail shown before and beside it. Every output is
 * written under a temporary name next to its final place and renamed when complete, so
 * readers (the tile server, other processes) never see half an output.
 */

/** Name of our own description of a pyramid, written beside sharp's `info.json`. */
const PYRAMID_JSON = "pyramid.json";

export type BuildPyramidOptions = {
  tileSize?: number;
  quality?: number;
  pixelCap?: number;
  /** Called with whole percentages, never decreasing: 0–99 while tiling, 100 once in place. */
  onProgress?: (percent: number) => void;
  /** How often the temporary folder is counted, in ms. */
  pollMs?: number;
};

function siblingName(target: string, tag: string): string {
  // No dot in the added part: libvips strips a final ".suffix" from output names.
  return path.join(path.dirname(target), `${path.basename(target)}-${tag}-${randomBytes(6).toString("hex")}`);
}

/**
 * Reports tiling progress by counting the region folders sharp has created so far: one
 * `readdir` per poll, whatever the pyramid's size (a full recursive count would cost three
 * directory reads per tile on every poll).
 */
function startProgress(folder: string, expected: number, report: (p: number) => void, pollMs: number): () => Promise<void> {
  let last = -1;
  let pending: Promise<void> = Promise.resolve();
  const emit = (p: number) => {
    if (p <= last) return;
    last = p;
    try {
      report(p);
    } catch {
      // A failing progress listener must not abort or crash the tiling itself.
    }
  };
  const poll = async () => {
    const names = await readdir(folder).catch(() => [] as string[]);
    const regions = names.filter((n) => !n.endsWith(".json") && !n.endsWith(".xml")).length;
    emit(Math.min(99, Math.floor((99 * regions) / expected)));
  };
  emit(0);
  const timer = setInterval(() => {
    pending = pending.then(poll);
  }, pollMs);
  return async () => {
    clearInterval(timer);
    await pending;
  };
}

/** Checks that what sharp wrote is the layout our tile algorithm describes. */
async function verifyLayout(folder: string, d: PyramidDescription): Promise<void> {
  const info = JSON.parse(await readFile(path.join(folder, "info.json"), "utf8")) as {
    width?: number;
    height?: number;
    tiles?: { scaleFactors?: number[] }[];
  };
  const written = info.tiles?.[0]?.scaleFactors ?? [];
  const same = info.width === d.width && info.height === d.height && written.join(",") === d.scaleFactors.join(",");
  const coarsest = d.scaleFactors[d.scaleFactors.length - 1];
  const whole = tilePath(
    { region: { x: 0, y: 0, w: d.width, h: d.height }, size: { w: Math.ceil(d.width / coarsest), h: Math.ceil(d.height / coarsest) } },
    d.width,
    d.height,
  );
  if (!same || !(await stat(path.join(folder, whole)).catch(() => null))) {
    throw new Error("The tiler wrote a layout that differs from the IIIF tile algorithm (was libvips upgraded?).");
  }
}

/** Moves a finished folder into place, replacing an older one only after the new one is there. */
async function swapIntoPlace(built: string, target: string): Promise<void> {
  const previous = siblingName(target, "old");
  const hadPrevious = await rename(target, previous).then(
    () => true,
    (err: NodeJS.ErrnoException) => {
      if (err.code === "ENOENT") return false;
      throw err;
    },
  );
  try {
    await rename(built, target);
  } catch (err) {
    if (hadPrevious) await rename(previous, target).catch(() => {});
    throw err;
  }
  if (hadPrevious) await rm(previous, { recursive: true, force: true });
}

/**
 * Writes the IIIF 3 level 0 pyramid of `inputPath` to `outDir` (sharp's tiles and info.json
 * plus our `pyramid.json`), built in a temporary sibling folder and renamed into place when
 * complete; on failure nothing is left behind. Refuses unsupported, over-large and damaged
 * inputs with an ImageRejectedError.
 */
export async function buildPyramid(inputPath: string, outDir: string, options: BuildPyramidOptions = {}): Promise<PyramidDescription> {
  const { tileSize = DEFAULT_TILE_SIZE, quality = 85, pixelCap = DEFAULT_PIXEL_CAP, pollMs = 300 } = options;
  const report = options.onProgress ?? (() => {});
  const { width, height } = await probeImage(inputPath, pixelCap);
  const description: PyramidDescription = { width, height, tileSize, scaleFactors: scaleFactors(width, height, tileSize) };
  // A private work folder: libvips also writes vips-properties.xml beside (not inside) the
  // pyramid folder, which must not litter outDir's parent or collide with another job.
  const work = siblingName(outDir, "partial");
  const built = path.join(work, "pyramid");
  await mkdir(work, { recursive: true });
  const stop = startProgress(built, expectedRegionCount(width, height, tileSize), report, pollMs);
  try {
    // Huffman optimisation off, as libvips' own dzsave default: same image, less time per tile.
    await sharpInput(inputPath, pixelCap).jpeg({ quality, optimiseCoding: false }).tile({ layout: "iiif3", size: tileSize, overlap: 0 }).toFile(built);
    await stop();
    await verifyLayout(built, description);
    await writeFile(path.join(built, PYRAMID_JSON), JSON.stringify(description));
    await swapIntoPlace(built, outDir);
  } catch (err) {
    throw rejectionFrom(err, pixelCap);
  } finally {
    await stop();
    await rm(work, { recursive: true, force: true });
  }
  report(100);
  return description;
}

/** Reads and checks the `pyramid.json` of a built pyramid folder. */
export async function readPyramidDescription(dir: string): Promise<PyramidDescription> {
  const raw = JSON.parse(await readFile(path.join(dir, PYRAMID_JSON), "utf8")) as Partial<PyramidDescription>;
  const { width, height, tileSize, scaleFactors: factors } = raw;
  const ok = [width, height, tileSize].every((n) => Number.isSafeInteger(n) && (n as number) > 0);
  if (!ok || !Array.isArray(factors) || !factors.every((s) => Number.isSafeInteger(s) && s > 0)) {
    throw new Error(`${PYRAMID_JSON} in ${dir} is malformed`);
  }
  return { width: width as number, height: height as number, tileSize: tileSize as number, scaleFactors: factors };
}

/** A JPEG no larger than `longSide` on its longer side, written atomically; returns its size. */
async function buildDownscaled(inputPath: string, outFile: string, longSide: number, pixelCap: number): Promise<{ width: number; height: number }> {
  await probeImage(inputPath, pixelCap);
  await mkdir(path.dirname(outFile), { recursive: true });
  // Keeps the ".jpg" ending on the temporary name: sharp picks the output format from it.
  const temp = `${siblingName(outFile, "partial")}.jpg`;
  try {
    const info = await sharpInput(inputPath, pixelCap)
      .resize({ width: longSide, height: longSide, fit: "inside", withoutEnlargement: true })
      .jpeg({ quality: 85 })
      .toFile(temp);
    await rename(temp, outFile);
    return { width: info.width, height: info.height };
  } catch (err) {
    await rm(temp, { force: true });
    throw rejectionFrom(err, pixelCap);
  }
}

/**
 * The preview shown while the pyramid is being built: a JPEG of at most `longSide` px on the
 * longer side, never enlarged. Its scale against the original is width / original width.
 */
export function buildPreview(inputPath: string, outFile: string, longSide = 2048, pixelCap = DEFAULT_PIXEL_CAP) {
  return buildDownscaled(inputPath, outFile, longSide, pixelCap);
}

/** A thumbnail JPEG of about `longSide` px (256 by default) on the longer side. */
export function buildThumbnail(inputPath: string, outFile: string, longSide = 256, pixelCap = DEFAULT_PIXEL_CAP) {
  return buildDownscaled(inputPath, outFile, longSide, pixelCap);
}
