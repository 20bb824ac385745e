import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, describe, expect, it } from "vitest";
import { detectRasterFormat } from "@/lib/tiles/magic-bytes";
import { bigTiffHeader } from "./bigtiff";

// Reference: libvips (through sharp) reading the file back: it must see the size, the bands
// and exactly the pixels that were appended after the header.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-bigtiff-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe("bigTiffHeader", () => {
  for (const channels of [1, 3] as const) {
    it(`makes a ${channels}-band strip BigTIFF that libvips reads back pixel for pixel`, async () => {
      const width = 301;
      const height = 203; // not a multiple of the strip height: a short last strip
      const pixels = Buffer.alloc(width * height * channels);
      for (let i = 0; i < pixels.length; i++) pixels[i] = (i * 7919) % 251;
      const file = path.join(dir, `t${channels}.tif`);
      const header = bigTiffHeader({ width, height, channels, rowsPerStrip: 64 });
      fs.writeFileSync(file, Buffer.concat([header, pixels]));
      expect(detectRasterFormat(header.subarray(0, 16))).toBe("bigtiff");
      const meta = await sharp(file).metadata();
      expect([meta.width, meta.height, meta.channels]).toEqual([width, height, channels]);
      // sharp hands grey images out as sRGB unless asked for the one band.
      const img = sharp(file);
      const { data } = await (channels === 1 ? img.extractChannel(0) : img).raw().toBuffer({ resolveWithObject: true });
      expect(Buffer.compare(data, pixels)).toBe(0);
    });
  }
});
