import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import { readPyramidDescription } from "@/server/images/pyramid";
import type { ObjectStore } from "./object-store";
import { writeTilePack } from "./tile-pack";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

const dirs = async (p: string) =>
  (await fs.readdir(p, { withFileTypes: true }).catch(() => [])).filter((e) => e.isDirectory()).map((e) => e.name);

/**
 * Brings a data dir written before the object store up to date, at start in local mode: each
 * pyramid folder `tiles/<die>/<id>/` becomes its tile pack `tiles/<die>/<id>.tilepack` (packed
 * in `scratch`, stored, then the folder removed), work folders the old builder left beside it
 * go, and so does the old upload folder `originals/.incoming`. Nothing to do costs one listing.
 */
export async function packLegacyPyramids(store: ObjectStore, root: string, scratch: string): Promise<number> {
  let packed = 0;
  await fs.rm(path.join(/*turbopackIgnore: true*/ root, "originals", ".incoming"), { recursive: true, force: true });
  const tiles = path.join(/*turbopackIgnore: true*/ root, "tiles");
  for (const die of (await dirs(tiles)).filter((n) => UUID.test(n))) {
    for (const name of await dirs(path.join(/*turbopackIgnore: true*/ tiles, die))) {
      const folder = path.join(/*turbopackIgnore: true*/ tiles, die, name);
      if (!UUID.test(name)) {
        // `<id>-partial-…` / `<id>-old-…`: a killed build or swap of the old folder builder.
        if (UUID.test(name.slice(0, 36)) && /^-(partial|old)-/.test(name.slice(36))) await fs.rm(folder, { recursive: true, force: true });
        continue;
      }
      const description = await readPyramidDescription(folder).catch(() => null);
      if (description) {
        await fs.mkdir(scratch, { recursive: true });
        const file = path.join(/*turbopackIgnore: true*/ scratch, `legacy-${name}.tilepack`);
        try {
          await writeTilePack(folder, description, file);
          await store.putFile(`tiles/${die}/${name}.tilepack`, file, "application/octet-stream");
          packed++;
        } catch (e) {
          // Another process on the same data dir packed it first, or the folder is damaged: keep
          // the folder for a look and go on starting (its micrograph can be tiled again).
          console.error(`[kerfline] could not pack the pyramid folder ${folder}: ${(e as Error).message}`);
          continue;
        } finally {
          await fs.rm(file, { force: true });
        }
      }
      // Packed, or never finished (no pyramid.json: the old builder renamed only whole folders).
      await fs.rm(folder, { recursive: true, force: true });
    }
  }
  return packed;
}
