import { existsSync } from "node:fs";
import { readFile, readdir, writeFile, mkdir } from "node:fs/promises";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectedTilePaths } from "@/lib/tiles/iiif";
import { ImageRejectedError } from "./limits";
import { buildPreview, buildPyramid, buildThumbnail, readPyramidDescription } from "./pyramid";
import { listFiles, tempDir } from "../../tests/support/files";

let work: Awaited<ReturnType<typeof tempDir>>;
let input: string;
const W = 3000;
const H = 2000;

beforeAll(async () => {
  work = await tempDir("pyramid");
  input = path.join(work.dir, "micrograph.jpg");
  // Noise makes JPEG encoding slow enough that progress is seen between 0 and 100.
  await sharp({ create: { width: W, height: H, channels: 3, background: "#000", noise: { type: "gaussian", mean: 128, sigma: 50 } } })
    .jpeg({ quality: 90 })
    .toFile(input);
});
afterAll(async () => {
  await work.cleanup();
});

describe("buildPyramid", () => {
  it("reports non-decreasing progress from 0 that ends at 100", async () => {
    const seen: number[] = [];
    await buildPyramid(input, path.join(work.dir, "progress", "tiles"), { pollMs: 10, onProgress: (p) => seen.push(p) });
    expect(seen[0]).toBe(0);
    expect(seen[seen.length - 1]).toBe(100);
    expect(seen.filter((p) => p === 100)).toHaveLength(1);
    expect(seen.every((p, i) => i === 0 || p > seen[i - 1])).toBe(true);
    expect(seen.slice(0, -1).every((p) => p >= 0 && p <= 99)).toBe(true);
  });

  it("makes the folder appear only once it is complete", async () => {
    const parent = path.join(work.dir, "atomic");
    const out = path.join(parent, "tiles");
    const tiles = expectedTilePaths(W, H).length;
    const partialViews: string[] = [];
    const watcher = setInterval(() => {
      // Whenever the final folder is visible, it must already hold our pyramid.json.
      if (existsSync(out) && !existsSync(path.join(out, "pyramid.json"))) partialViews.push("seen without pyramid.json");
    }, 2);
    try {
      await buildPyramid(input, out, { pollMs: 20 });
    } finally {
      clearInterval(watcher);
    }
    expect(partialViews).toEqual([]);
    expect(await readdir(parent)).toEqual(["tiles"]);
    expect(await listFiles(out, ".jpg")).toHaveLength(tiles);
    expect(await readPyramidDescription(out)).toEqual({ width: W, height: H, tileSize: 512, scaleFactors: [1, 2, 4, 8] });
  });

  it("replaces an earlier pyramid in the same folder", async () => {
    const out = path.join(work.dir, "rebuild", "tiles");
    await mkdir(out, { recursive: true });
    await writeFile(path.join(out, "stale.txt"), "old");
    await buildPyramid(input, out);
    expect(existsSync(path.join(out, "stale.txt"))).toBe(false);
    expect(await readdir(path.dirname(out))).toEqual(["tiles"]);
  });

  it("leaves nothing behind when tiling fails", async () => {
    const broken = path.join(work.dir, "broken.jpg");
    const bytes = await readFile(input);
    await writeFile(broken, bytes.subarray(0, Math.floor(bytes.length * 0.6)));
    const parent = path.join(work.dir, "failure");
    const seen: number[] = [];
    const err = await buildPyramid(broken, path.join(parent, "tiles"), { pollMs: 10, onProgress: (p) => seen.push(p) }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ImageRejectedError);
    expect(await readdir(parent)).toEqual([]);
    expect(seen).not.toContain(100);
  });
});

describe("preview and thumbnail", () => {
  it("fits the preview inside 2048 px and the thumbnail inside 256 px, keeping the aspect", async () => {
    const preview = path.join(work.dir, "derived", "preview.jpg");
    const thumb = path.join(work.dir, "derived", "thumb.jpg");
    // Expected sizes by hand: 2000 · 2048 / 3000 = 1365.3 and 2000 · 256 / 3000 = 170.7 px tall.
    expect(await buildPreview(input, preview)).toEqual({ width: 2048, height: 1365 });
    expect(await buildThumbnail(input, thumb)).toEqual({ width: 256, height: 171 });
    const meta = await sharp(preview, { limitInputPixels: 10_000_000 }).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(["jpeg", 2048, 1365]);
    expect((await readdir(path.dirname(preview))).sort()).toEqual(["preview.jpg", "thumb.jpg"]);
  });

  it("never enlarges a small image", async () => {
    const small = path.join(work.dir, "small.png");
    await sharp({ create: { width: 300, height: 100, channels: 3, background: "#123" } })
      .png()
      .toFile(small);
    expect(await buildPreview(small, path.join(work.dir, "small-preview.jpg"))).toEqual({ width: 300, height: 100 });
  });
});
