// Storage benchmark: a real pyramid (sharp's IIIF 3 folder of a 20000 × 20000 px JPEG, about
// 2,100 tiles) stored as one object per tile against one tile pack, in s3rver and in the data
// dir: time to store, to read a sample of tiles, and to delete. Not a test: it prints figures.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { S3Client } from "@aws-sdk/client-s3";
import { buildPyramid, readPyramidDescription } from "@/server/images/pyramid";
import { localStore } from "@/server/storage/local-store";
import { s3Store } from "@/server/storage/s3-store";
import { openTilePack, tileRange, writeTilePack, forgetTilePack } from "@/server/storage/tile-pack";
import type { ObjectStore } from "@/server/storage/object-store";
import { startFakeS3 } from "../../tests/support/s3-fake";
import { benchImage } from "./tiling";

const ms = (t0: number) => performance.now() - t0;
const IN_FLIGHT = Number(process.env.BENCH_IN_FLIGHT ?? 8);
/** Storage keys take no commas: the per-tile layout spells IIIF's `x,y,w,h` with underscores. */
const tileKey = (t: string) => `bench/many/${t.replaceAll(",", "_")}`;

async function drain(s: NodeJS.ReadableStream | null): Promise<number> {
  let n = 0;
  for await (const c of s!) n += (c as Buffer).length;
  return n;
}

/** Runs `fn` over `items` with `width` in flight, as an uploader of many small objects would. */
async function parallel<T>(items: T[], width: number, fn: (t: T) => Promise<unknown>): Promise<void> {
  let next = 0;
  await Promise.all(
    Array.from({ length: width }, async () => {
      while (next < items.length) await fn(items[next++]);
    }),
  );
}

function stats(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return { mean: s.reduce((a, b) => a + b, 0) / s.length, p95: s[Math.floor(s.length * 0.95)] };
}

async function compare(name: string, store: ObjectStore, folder: string, tiles: string[], packFile: string, sample: string[]) {
  const t1 = performance.now();
  await parallel(tiles, IN_FLIGHT, (t) => store.putFile(tileKey(t), path.join(folder, t), "image/jpeg"));
  const putMany = ms(t1);
  const t2 = performance.now();
  await store.putFile("bench/one.tilepack", packFile);
  const putPack = ms(t2);

  const readMany: number[] = [];
  for (const t of sample) {
    const t0 = performance.now();
    await drain(await store.read(tileKey(t)));
    readMany.push(ms(t0));
  }
  forgetTilePack("bench/one.tilepack");
  const t3 = performance.now();
  const pack = (await openTilePack(store, "bench/one.tilepack"))!;
  const openMs = ms(t3);
  const readPack: number[] = [];
  for (const t of sample) {
    const t0 = performance.now();
    const r = tileRange(pack, t)!;
    await drain(await store.read("bench/one.tilepack", r));
    readPack.push(ms(t0));
  }
  const t4 = performance.now();
  await store.removePrefix("bench/many/");
  const delMany = ms(t4);
  const t5 = performance.now();
  await store.remove("bench/one.tilepack");
  const delPack = ms(t5);
  const a = stats(readMany);
  const b = stats(readPack);
  console.log(`\n${name}: ${tiles.length} tile objects vs one pack`);
  console.log(`  store:  ${(putMany / 1000).toFixed(2)} s (${tiles.length} PUTs, ${IN_FLIGHT} in flight)  vs  ${(putPack / 1000).toFixed(2)} s (one putFile)`);
  console.log(
    `  read ${sample.length} tiles one after another: ${a.mean.toFixed(2)} ms mean, p95 ${a.p95.toFixed(2)}  vs  ${b.mean.toFixed(2)} ms mean, p95 ${b.p95.toFixed(2)} (+ ${openMs.toFixed(1)} ms once to read footer and index)`,
  );
  console.log(`  delete: ${delMany.toFixed(0)} ms (list + batched deletes)  vs  ${delPack.toFixed(1)} ms (one delete)`);
}

export async function benchStorage(): Promise<void> {
  const work = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-bench-storage-"));
  const fake = await startFakeS3("kerfline-bench");
  const s3 = new S3Client({
    endpoint: fake.endpoint,
    region: "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
  });
  try {
    // The pyramid is built once and kept beside the bench image: only storage is measured here.
    const folder = path.join(os.tmpdir(), "kerfline-bench", "storage-pyramid");
    const t0 = performance.now();
    const description = fs.existsSync(path.join(folder, "pyramid.json"))
      ? await readPyramidDescription(folder)
      : await buildPyramid(await benchImage(), folder, { pollMs: 1000 });
    const tileMs = ms(t0);
    const tiles = fs
      .readdirSync(folder, { recursive: true, withFileTypes: true })
      .filter((e) => e.isFile() && e.name.endsWith(".jpg"))
      .map((e) => path.relative(folder, path.join(e.parentPath, e.name)).split(path.sep).join("/"));
    const packFile = path.join(work, "pyramid.tilepack");
    const t1 = performance.now();
    const packed = await writeTilePack(folder, description, packFile);
    const packMs = ms(t1);
    console.log(
      `pyramid: ${tiles.length} tiles, ${(packed.bytes / 1e6).toFixed(1)} MB; sharp ${(tileMs / 1000).toFixed(1)} s, packing ${(packMs / 1000).toFixed(2)} s`,
    );
    // A fixed sample (every 7th tile) so both layouts read the same tiles.
    const sample = tiles.filter((_, i) => i % 7 === 0).slice(0, 300);
    await compare("s3rver (S3 API over HTTP)", s3Store(s3, fake.bucket), folder, tiles, packFile, sample);
    await compare(
      "data dir (local store)",
      localStore({ root: path.join(work, "store"), tempDir: path.join(work, "scratch") }),
      folder,
      tiles,
      packFile,
      sample,
    );
  } finally {
    s3.destroy();
    await fake.stop();
    fs.rmSync(work, { recursive: true, force: true });
  }
}
