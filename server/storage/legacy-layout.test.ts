import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildPyramid } from "@/server/images/pyramid";
import { listFiles, tempDir } from "../../tests/support/files";
import { localStore } from "./local-store";
import { packLegacyPyramids } from "./legacy-layout";
import { openTilePack, tileRange } from "./tile-pack";

/*
 * A data dir in the earlier layout, made with the earlier builder's own output (sharp's IIIF 3
 * folder plus pyramid.json, which buildPyramid still writes): after the start-up step every
 * tile is served from the pack byte-equal to sharp's file, and no folder is left.
 */
const DIE = "0b6b0d8e-3a53-4d47-9a51-5f3b1a9d1c2e";
const ID = "6f1c2d3e-4a5b-4c6d-8e7f-901a2b3c4d5e";
let work: Awaited<ReturnType<typeof tempDir>>;
let copy: string;

beforeAll(async () => {
  work = await tempDir("legacy-layout");
  const input = path.join(work.dir, "m.jpg");
  await sharp({ create: { width: 700, height: 500, channels: 3, background: "#000", noise: { type: "gaussian", mean: 128, sigma: 40 } } })
    .jpeg()
    .toFile(input);
  const folder = path.join(work.dir, "root", "tiles", DIE, ID);
  await buildPyramid(input, folder, { tileSize: 256 });
  copy = path.join(work.dir, "sharp-output");
  fs.cpSync(folder, copy, { recursive: true });
  fs.mkdirSync(path.join(work.dir, "root", "tiles", DIE, `${ID}-partial-a1b2c3d4e5f6`), { recursive: true });
  fs.mkdirSync(path.join(work.dir, "root", "originals", ".incoming"), { recursive: true });
});
afterAll(async () => {
  await work?.cleanup();
});

describe("packLegacyPyramids", () => {
  it("turns each pyramid folder into its tile pack and removes the old folders", async () => {
    const root = path.join(work.dir, "root");
    const store = localStore({ root, tempDir: path.join(work.dir, "scratch") });
    expect(await packLegacyPyramids(store, root, path.join(work.dir, "scratch"))).toBe(1);
    expect(fs.readdirSync(path.join(root, "tiles", DIE))).toEqual([`${ID}.tilepack`]);
    expect(fs.existsSync(path.join(root, "originals", ".incoming"))).toBe(false);
    const pack = (await openTilePack(store, `tiles/${DIE}/${ID}.tilepack`))!;
    const names = await listFiles(copy, ".jpg");
    expect(Object.keys(pack.index.tiles).sort()).toEqual(names);
    for (const name of names) {
      const r = tileRange(pack, name)!;
      const parts: Buffer[] = [];
      for await (const c of (await store.read(`tiles/${DIE}/${ID}.tilepack`, r))!) parts.push(c as Buffer);
      expect(Buffer.concat(parts).equals(fs.readFileSync(path.join(copy, name))), name).toBe(true);
    }
    // A second start finds nothing to do.
    expect(await packLegacyPyramids(store, root, path.join(work.dir, "scratch"))).toBe(0);
  });
});
