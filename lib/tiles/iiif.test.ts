import { readFile } from "node:fs/promises";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildInfoJson, expectedTilePaths, levelTiles, parseTileRequest, resolveTilePath, scaleFactors, type PyramidDescription } from "./iiif";
import { buildPyramid } from "../../server/images/pyramid";
import { listFiles, run, tempDir } from "../../tests/support/files";

const SIZES: [number, number][] = [
  [1, 1],
  [1, 700],
  [513, 513],
  [1000, 333],
  [2049, 1025],
  [5000, 3001],
];

let work: Awaited<ReturnType<typeof tempDir>>;
beforeAll(async () => {
  work = await tempDir("iiif");
});
afterAll(async () => {
  await work.cleanup();
});

async function blankPng(width: number, height: number): Promise<string> {
  const file = path.join(work.dir, `in-${width}x${height}.png`);
  await sharp({ create: { width, height, channels: 3, background: "#556677" } })
    .png()
    .toFile(file);
  return file;
}

describe("info.json", () => {
  const info = buildInfoJson({ id: "https://kerfline.test/iiif/m1", width: 5000, height: 3001, tileSize: 512, scaleFactors: [1, 2, 4, 8, 16] });

  it("carries every property the Image API 3.0 requires of a level 0 service", () => {
    // IIIF Image API 3.0, §5.2 Technical Properties and §5.6 tiles (iiif.io/api/image/3.0).
    expect(info["@context"]).toBe("http://iiif.io/api/image/3/context.json");
    expect(info.id).toBe("https://kerfline.test/iiif/m1");
    expect(info.type).toBe("ImageService3");
    expect(info.protocol).toBe("http://iiif.io/api/image");
    expect(info.profile).toBe("level0");
    expect(info.width).toBe(5000);
    expect(info.height).toBe(3001);
    expect(info.tiles).toEqual([{ width: 512, height: 512, scaleFactors: [1, 2, 4, 8, 16] }]);
  });

  it("refuses scale factors that are not distinct positive integers", () => {
    // IIIF Image API 3.0 §5.6: scaleFactors is an array of distinct positive integers.
    const base = { id: "x", width: 10, height: 10, tileSize: 512 };
    expect(() => buildInfoJson({ ...base, scaleFactors: [1, 1] })).toThrow();
    expect(() => buildInfoJson({ ...base, scaleFactors: [0] })).toThrow();
    expect(() => buildInfoJson({ ...base, scaleFactors: [1.5] })).toThrow();
  });
});

describe("scale factors", () => {
  it("halves down to the first level that fits one tile (worked by hand)", () => {
    // Hand-worked: 5000 / 8 = 625 > 512 but ceil(5000 / 16) = 313 ≤ 512, so 16 is the last factor.
    expect(scaleFactors(5000, 3001, 512)).toEqual([1, 2, 4, 8, 16]);
    // ceil(2049 / 4) = 513 > 512, ceil(2049 / 8) = 257.
    expect(scaleFactors(2049, 1025, 512)).toEqual([1, 2, 4, 8]);
    expect(scaleFactors(512, 512, 512)).toEqual([1]);
    expect(scaleFactors(1, 1, 512)).toEqual([1]);
  });

  it("agrees with the scale factors sharp's libvips writes into its info.json", async () => {
    // Independent reference: libvips dzsave (inside sharp 0.35) --layout iiif3 info.json.
    for (const [w, h] of SIZES) {
      const out = path.join(work.dir, `sharp-${w}x${h}`);
      await buildPyramid(await blankPng(w, h), out);
      const info = JSON.parse(await readFile(path.join(out, "info.json"), "utf8"));
      expect(info.tiles[0].scaleFactors, `${w}×${h}`).toEqual(scaleFactors(w, h, 512));
    }
  });
});

describe("tile regions and sizes", () => {
  it("follows the published formula on a hand-worked example", () => {
    // IIIF Image API 3.0 implementation notes: x = n·tw·s, w = min(tw·s, W − x), size = ceil(w/s).
    // By hand for W×H = 5000×3001, tw = 512, s = 8, column n = 1, row m = 0:
    // x = 1·512·8 = 4096; w = min(4096, 5000 − 4096) = 904; h = min(4096, 3001) = 3001;
    // size = ceil(904/8) × ceil(3001/8) = 113 × 376.
    const tiles = levelTiles(5000, 3001, 512, 8);
    expect(tiles).toHaveLength(2);
    expect(tiles[1]).toEqual({ scaleFactor: 8, region: { x: 4096, y: 0, w: 904, h: 3001 }, size: { w: 113, h: 376 } });
    expect(tiles[0].size).toEqual({ w: 512, h: 376 });
  });

  for (const [w, h] of SIZES) {
    it(`lists exactly the files vips dzsave writes for ${w}×${h}`, async () => {
      // Independent reference: Debian's `vips dzsave --layout iiif3` (libvips 8.14 CLI), which
      // spells the whole-image region as 0,0,W,H (sharp's libvips 8.18 writes "full").
      const out = path.join(work.dir, `vips-${w}x${h}`);
      await run("vips", ["dzsave", await blankPng(w, h), out, "--layout", "iiif3", "--tile-size", "512", "--overlap", "0", "--suffix", ".jpg[Q=85]"]);
      expect(await listFiles(out, ".jpg")).toEqual(expectedTilePaths(w, h, 512, "coordinates").sort());
    });

    it(`lists exactly the files buildPyramid writes for ${w}×${h}`, async () => {
      const out = path.join(work.dir, `ours-${w}x${h}`);
      await buildPyramid(await blankPng(w, h), out);
      expect(await listFiles(out, ".jpg")).toEqual(expectedTilePaths(w, h, 512).sort());
    });
  }
});

describe("parseTileRequest", () => {
  it("accepts canonical regions and sizes", () => {
    expect(parseTileRequest("4096,0,904,3001", "113,376")).toEqual({ region: { x: 4096, y: 0, w: 904, h: 3001 }, size: { w: 113, h: 376 } });
    expect(parseTileRequest("full", "313,188")).toEqual({ region: "full", size: { w: 313, h: 188 } });
    expect(parseTileRequest("full", "max")).toEqual({ region: "full", size: "max" });
  });

  it("rejects traversal, escapes and non-canonical forms", () => {
    const regions = [
      "..",
      "../info.json",
      "%2e%2e",
      "..%2f..",
      "0,0,512,512/..",
      "-1,0,512,512",
      "0,0,0,512",
      "00,0,512,512",
      "0,0,512,512 ",
      " full",
      "FULL",
      "square",
      "pct:0,0,50,50",
      "0,0,512",
      "0,0,512,512,1",
      "1e3,0,1,1",
      "0x10,0,1,1",
      "0.5,0,1,1",
      "+1,0,1,1",
      "0,0,9999999999,1",
      "",
    ];
    for (const r of regions) expect(parseTileRequest(r, "512,512"), r).toBeNull();
    const sizes = ["..", "512,", ",512", "!512,512", "^512,512", "^max", "pct:50", "0,512", "512,512/..", "512%2c512", "512 ,512", "MAX", ""];
    for (const s of sizes) expect(parseTileRequest("0,0,512,512", s), s).toBeNull();
  });
});

describe("resolveTilePath", () => {
  const pyramid: PyramidDescription = { width: 2049, height: 1025, tileSize: 512, scaleFactors: scaleFactors(2049, 1025, 512) };
  const resolve = (region: string, size: string) => {
    const req = parseTileRequest(region, size);
    return req && resolveTilePath(req, pyramid);
  };

  it("maps every stored tile's own path back to itself", () => {
    for (const p of expectedTilePaths(2049, 1025)) {
      const [region, size] = p.split("/");
      expect(resolve(region, size)).toBe(p);
    }
  });

  it("maps the whole-image coordinates to the stored full tile", () => {
    expect(resolve("0,0,2049,1025", "257,129")).toBe("full/257,129/0/default.jpg");
  });

  it("refuses regions and sizes that are not tiles of this pyramid", () => {
    expect(resolve("1,0,512,512", "512,512")).toBeNull();
    expect(resolve("0,0,512,512", "256,256")).toBeNull();
    expect(resolve("0,0,511,512", "511,512")).toBeNull();
    expect(resolve("4096,0,512,512", "512,512")).toBeNull();
    expect(resolve("full", "512,257")).toBeNull();
    expect(resolve("full", "max")).toBeNull();
    expect(resolve("0,0,512,512", "max")).toBeNull();
  });

  it("serves full/max only for an image no larger than one tile", () => {
    const small: PyramidDescription = { width: 300, height: 200, tileSize: 512, scaleFactors: [1] };
    expect(resolveTilePath({ region: "full", size: "max" }, small)).toBe("full/300,200/0/default.jpg");
  });
});
