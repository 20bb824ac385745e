import "server-only";
import { objectStore } from "../storage";
import { derivedKeys, diePrefixes, micrographKeys, mosaicFramesPrefix } from "../storage/keys";
import { forgetTilePack, forgetTilePacksUnder } from "../storage/tile-pack";

/**
 * Removes every object a die owns (originals, tiles, exports) after its rows are gone.
 * Objects are keyed per die, so one prefix removal per area leaves no orphans.
 */
export async function removeDieFiles(dieIds: string[]): Promise<void> {
  for (const id of dieIds) {
    if (!/^[0-9a-f-]{36}$/i.test(id)) continue;
    for (const prefix of diePrefixes(id)) {
      await objectStore().removePrefix(prefix);
      forgetTilePacksUnder(prefix);
    }
  }
}

/** Removes one micrograph's objects after its row is gone: original, pack, preview, thumbnail, and a mosaic's frames. */
export async function removeMicrographFiles(dieId: string, micrographId: string, format: string | null): Promise<void> {
  const original = micrographKeys(dieId, micrographId, format).original;
  await Promise.all([...derivedKeys(dieId, micrographId), ...(original ? [original] : [])].map((k) => objectStore().remove(k)));
  await objectStore().removePrefix(mosaicFramesPrefix(dieId, micrographId));
  forgetTilePack(micrographKeys(dieId, micrographId).pack);
}
