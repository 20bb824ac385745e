import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import { env } from "../env";

/**
 * Removes every file a die owns (originals, tiles, exports) after its rows are gone.
 * Files are laid out per die so one recursive removal leaves no orphans.
 */
export async function removeDieFiles(dieIds: string[]): Promise<void> {
  const root = env().dataDir;
  for (const id of dieIds) {
    if (!/^[0-9a-f-]{36}$/i.test(id)) continue;
    for (const area of ["originals", "tiles", "exports"]) {
      await fs.rm(path.join(/*turbopackIgnore: true*/ root, area, id), { recursive: true, force: true });
    }
  }
}
