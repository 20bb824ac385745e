import { readFile, writeFile } from "node:fs/promises";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { detectRasterFormat } from "./magic-bytes";
import { run, tempDir } from "../../tests/support/files";

let work: Awaited<ReturnType<typeof tempDir>>;
beforeAll(async () => {
  work = await tempDir("magic");
});
afterAll(async () => {
  await work.cleanup();
});

const base = () => sharp({ create: { width: 24, height: 16, channels: 3, background: "#a08040" } });

describe("detectRasterFormat on files written by reference encoders", () => {
  // Independent reference: files encoded by libvips (sharp 0.35 and the Debian vips CLI).
  it("recognises JPEG", async () => {
    expect(detectRasterFormat(await base().jpeg().toBuffer())).toBe("jpeg");
  });

  it("recognises PNG", async () => {
    expect(detectRasterFormat(await base().png().toBuffer())).toBe("png");
  });

  it("recognises classic TIFF", async () => {
    expect(detectRasterFormat(await base().tiff().toBuffer())).toBe("tiff");
  });

  it("recognises WebP", async () => {
    expect(detectRasterFormat(await base().webp().toBuffer())).toBe("webp");
  });

  it("recognises BigTIFF written by vips with the bigtiff option", async () => {
    const png = path.join(work.dir, "src.png");
    const big = path.join(work.dir, "big.tif");
    await base().png().toFile(png);
    await run("vips", ["copy", png, `${big}[bigtiff]`]);
    expect(detectRasterFormat(await readFile(big))).toBe("bigtiff");
  });

  it("recognises big-endian TIFF and BigTIFF headers", () => {
    // TIFF 6.0 §2 (Image File Header): "MM", 42, IFD offset; BigTIFF (libtiff's BigTIFF
    // design note): "MM", 43, offset size 8, zero, 8-byte IFD offset.
    expect(detectRasterFormat(Uint8Array.from([0x4d, 0x4d, 0, 42, 0, 0, 0, 8]))).toBe("tiff");
    expect(detectRasterFormat(Uint8Array.from([0x4d, 0x4d, 0, 43, 0, 8, 0, 0, 0, 0, 0, 0, 0, 0, 0, 16]))).toBe("bigtiff");
  });

  it("refuses GIF, SVG, HTML, text, PDF and short inputs", async () => {
    const gif = await base().gif().toBuffer();
    const svgFile = path.join(work.dir, "x.svg");
    await writeFile(svgFile, '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="4" height="4"/>');
    const others = [
      gif,
      await readFile(svgFile),
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><rect width="1" height="1"/></svg>'),
      Buffer.from("<!DOCTYPE html><html><body>not an image</body></html>"),
      Buffer.from("plain text that is long enough"),
      Buffer.from("%PDF-1.7\n%âãÏÓ\n"),
      Buffer.from("RIFF\x10\x00\x00\x00WAVEfmt ", "latin1"),
      Buffer.from([0xff, 0xd8]),
      Buffer.from("II*"),
      Buffer.from("II+\0\x04\0\0\0", "latin1"),
      Buffer.alloc(0),
    ];
    for (const bytes of others) expect(detectRasterFormat(bytes), bytes.subarray(0, 12).toString("latin1")).toBeNull();
  });
});
