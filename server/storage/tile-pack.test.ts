import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { S3Client } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectedTilePaths } from "@/lib/tiles/iiif";
import { encodeFooter } from "@/lib/tiles/tile-pack";
import { buildPyramid } from "@/server/images/pyramid";
import { listFiles, tempDir } from "../../tests/support/files";
import { startFakeS3, type FakeS3 } from "../../tests/support/s3-fake";
import { localStore } from "./local-store";
import { s3Store } from "./s3-store";
import { openTilePack, tileRange, writeTilePack } from "./tile-pack";
import type { ObjectStore } from "./object-store";

/*
 * Ground truth: the tile files sharp itself wrote in its IIIF 3 folder. Every tile read back
 * from the pack, through either store, must be byte-equal to sharp's file, and the pack must
 * hold exactly the tiles of the IIIF 3.0 tile algorithm (expectedTilePaths, tested in lib/tiles).
 */
async function bytes(s: NodeJS.ReadableStream | null): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const c of s!) parts.push(c as Buffer);
  return Buffer.concat(parts);
}

const W = 1900;
const H = 1100;
let work: Awaited<ReturnType<typeof tempDir>>;
let folder: string;
let pack: string;
let fake: FakeS3;
let s3: S3Client;
const stores: Record<string, () => ObjectStore> = {};

beforeAll(async () => {
  work = await tempDir("tile-pack");
  const input = path.join(work.dir, "micrograph.jpg");
  await sharp({ create: { width: W, height: H, channels: 3, background: "#000", noise: { type: "gaussian", mean: 128, sigma: 40 } } })
    .jpeg({ quality: 80 })
    .toFile(input);
  folder = path.join(work.dir, "pyramid");
  const description = await buildPyramid(input, folder, { tileSize: 256 });
  pack = path.join(work.dir, "p.tilepack");
  await writeTilePack(folder, description, pack);
  fake = await startFakeS3();
  s3 = new S3Client({ endpoint: fake.endpoint, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });
  stores.local = () => localStore({ root: path.join(work.dir, "root"), tempDir: path.join(work.dir, "scratch") });
  stores.s3 = () => s3Store(s3, fake.bucket);
});
afterAll(async () => {
  s3?.destroy();
  await fake?.stop();
  await work?.cleanup();
});

describe.each(["local", "s3"])("a tile pack in the %s store", (kind) => {
  it("serves every tile byte-equal to the file sharp wrote, and only the IIIF algorithm's tiles", async () => {
    const store = stores[kind]();
    const key = `tiles/${kind}/m.tilepack`;
    await store.putFile(key, pack);
    const opened = (await openTilePack(store, key))!;
    expect(opened.index.pyramid).toEqual({ width: W, height: H, tileSize: 256, scaleFactors: [1, 2, 4, 8] });
    const written = await listFiles(folder, ".jpg");
    expect(Object.keys(opened.index.tiles).sort()).toEqual(written);
    expect(written).toEqual(expectedTilePaths(W, H, 256).sort());
    for (const name of written) {
      const r = tileRange(opened, name)!;
      const got = await bytes(await store.read(key, { start: r.start, end: r.end }));
      expect(got.equals(fs.readFileSync(path.join(folder, name))), name).toBe(true);
    }
    expect(tileRange(opened, "0,0,1,1/1,1/0/default.jpg")).toBeNull();
    expect(tileRange(opened, "__proto__")).toBeNull();
    expect(await openTilePack(store, `tiles/${kind}/none.tilepack`)).toBeNull();
  });

  it("refuses an object that is not a pack", async () => {
    const store = stores[kind]();
    await store.putBuffer(`tiles/${kind}/junk.tilepack`, Buffer.alloc(100, 7));
    await expect(openTilePack(store, `tiles/${kind}/junk.tilepack`)).rejects.toThrow(/not a tile pack/);
    // A footer that points past the object's end (built by hand with the format's footer writer).
    await store.putBuffer(`tiles/${kind}/cut.tilepack`, Buffer.concat([Buffer.from("{}"), encodeFooter(0, 500)]));
    await expect(openTilePack(store, `tiles/${kind}/cut.tilepack`)).rejects.toThrow(/outside the pack/);
    // An index whose tile lies over the index itself.
    const index = Buffer.from(JSON.stringify({ version: 1, pyramid: { width: 1, height: 1, tileSize: 256, scaleFactors: [1] }, tiles: { "a.jpg": [0, 10] } }));
    await store.putBuffer(`tiles/${kind}/over.tilepack`, Buffer.concat([Buffer.from("abc"), index, encodeFooter(3, index.length)]));
    await expect(openTilePack(store, `tiles/${kind}/over.tilepack`)).rejects.toThrow(/out of range/);
  });
});
