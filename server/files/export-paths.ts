import "server-only";
import path from "node:path";
import { env } from "../env";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Where rendered exports live: exports/<dieId>/<exportId>.png under the data dir, named only
 * from server-made UUIDs, so deleting a die's folder removes its exports with it.
 */
export function exportFilePath(dieId: string, exportId: string): string {
  if (!UUID.test(dieId) || !UUID.test(exportId)) throw new Error("export paths take UUIDs");
  return path.join(/*turbopackIgnore: true*/ env().dataDir, "exports", dieId.toLowerCase(), `${exportId.toLowerCase()}.png`);
}
