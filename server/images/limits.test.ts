import { readdir, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { crc32, deflateSync } from "node:zlib";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { DEFAULT_PIXEL_CAP, ImageRejectedError, probeImage, sharpInputOptions } from "./limits";
import { buildPyramid } from "./pyramid";
import { run, tempDir } from "../../tests/support/files";

let work: Awaited<ReturnType<typeof tempDir>>;
beforeAll(async () => {
  work = await tempDir("limits");
});
afterAll(async () => {
  await work.cleanup();
});

/** A PNG chunk: length, type, data, CRC-32 over type + data (PNG spec, W3C 2003, §5.3). */
function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** A hand-made PNG whose IHDR declares width × height, 8-bit RGB (PNG spec §11.2.2). */
function pngWithHeader(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: truecolour
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, pngChunk("IHDR", ihdr), pngChunk("IDAT", deflateSync(Buffer.alloc(64))), pngChunk("IEND", Buffer.alloc(0))]);
}

async function rejection(promise: Promise<unknown>): Promise<ImageRejectedError> {
  const err = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(ImageRejectedError);
  return err as ImageRejectedError;
}

describe("pixel cap", () => {
  it("passes the cap explicitly in the input options", () => {
    expect(sharpInputOptions().limitInputPixels).toBe(2_500_000_000);
    expect(sharpInputOptions(1000).limitInputPixels).toBe(1000);
  });

  it("crafts a header that a PNG reader accepts", async () => {
    // Independent reference: libvips' PNG reader (through sharp) parses our IHDR and its CRC.
    const file = path.join(work.dir, "small-header.png");
    await writeFile(file, pngWithHeader(3, 2));
    const meta = await sharp(file, { limitInputPixels: DEFAULT_PIXEL_CAP }).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(["png", 3, 2]);
  });

  it("refuses a PNG declaring 100000 × 100000 px from its header alone", async () => {
    // 10^10 px is four times the 2.5-gigapixel cap; the file holds a few bytes of pixel data,
    // so a refusal within a fraction of a second shows nothing was decoded.
    const file = path.join(work.dir, "huge-header.png");
    await writeFile(file, pngWithHeader(100_000, 100_000));
    const started = performance.now();
    const err = await rejection(probeImage(file));
    expect(performance.now() - started).toBeLessThan(1000);
    expect(err.reason).toBe("too_many_pixels");
    expect(err.status).toBe(413);
    expect(err.message).toMatch(/limit of 2\.5 gigapixels/);
  });

  it("honours a lower cap passed by the caller", async () => {
    const file = path.join(work.dir, "medium.png");
    await sharp({ create: { width: 1200, height: 1000, channels: 3, background: "#000" } })
      .png()
      .toFile(file);
    expect((await rejection(probeImage(file, 1_000_000))).reason).toBe("too_many_pixels");
    await expect(probeImage(file, 1_200_000)).resolves.toEqual({ format: "png", width: 1200, height: 1000 });
  });
});

describe("accepted inputs", () => {
  it("reads the header of a BigTIFF written by vips", async () => {
    // Independent reference: Debian's vips CLI writes the BigTIFF (tiffsave option bigtiff).
    const png = path.join(work.dir, "for-bigtiff.png");
    const tif = path.join(work.dir, "big.tif");
    await sharp({ create: { width: 640, height: 480, channels: 3, background: "#406080" } })
      .png()
      .toFile(png);
    await run("vips", ["copy", png, `${tif}[bigtiff,tile]`]);
    await expect(probeImage(tif)).resolves.toEqual({ format: "bigtiff", width: 640, height: 480 });
  });
});

describe("unsupported and damaged inputs", () => {
  it("refuses SVG and HTML by content before any decoder runs", async () => {
    const svg = path.join(work.dir, "drawing.png");
    await writeFile(svg, '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"/>');
    const err = await rejection(probeImage(svg));
    expect(err.reason).toBe("unsupported_format");
    expect(err.status).toBe(415);
  });

  for (const format of ["jpeg", "png"] as const) {
    it(`refuses a truncated ${format.toUpperCase()} when tiling, with a clear message and no leftovers`, async () => {
      const whole = await sharp({ create: { width: 900, height: 700, channels: 3, background: "#000", noise: { type: "gaussian", mean: 128, sigma: 40 } } })
        .toFormat(format)
        .toBuffer();
      const folder = path.join(work.dir, `truncated-${format}`);
      const file = path.join(work.dir, `truncated.${format}`);
      await writeFile(file, whole.subarray(0, Math.floor(whole.length / 2)));
      const err = await rejection(buildPyramid(file, path.join(folder, "tiles")));
      expect(err.reason).toBe("damaged");
      expect(err.message).toMatch(/damaged or incomplete/);
      expect(await readdir(folder)).toEqual([]);
    });
  }
});

describe("configureSharp", () => {
  // The process's core count comes from Node (os.availableParallelism); a stand-in of 3 shows
  // the setting follows it rather than a fixed number.
  it("gives libvips one thread per core the process may use", async () => {
    const before = sharp.concurrency();
    const spy = vi.spyOn(os, "availableParallelism").mockReturnValue(3);
    try {
      vi.resetModules();
      const fresh = await import("./limits");
      fresh.configureSharp();
      expect(sharp.concurrency()).toBe(3);
    } finally {
      spy.mockRestore();
      sharp.concurrency(before);
    }
  });
});
