import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadMicrograph } from "@/server/access/micrographs";
import { uuidSchema } from "@/lib/validation/common";
import { micrographKeys } from "@/server/storage/keys";
import { objectStore } from "@/server/storage";
import { openTilePack, readTile, tileRange } from "@/server/storage/tile-pack";
import { parseTileRequest, resolveTilePath } from "@/lib/tiles/iiif";
import { AppError, BadRequestError, NotFoundError } from "@/lib/errors";
import { serveImmutable } from "@/server/http/serve-file";
import { approveTileReads } from "@/server/http/fast-tiles";

// Every segment is validated: only canonical IIIF numbers reach the pack's index.
const params = z.object({
  micrographId: uuidSchema,
  region: z.string().max(64),
  size: z.string().max(32),
  rotation: z.literal("0", "only rotation 0 is served"),
  file: z.literal("default.jpg", "only default.jpg is served"),
});

/** One tile of a micrograph's level-0 IIIF pyramid, for members of its team. */
export const GET = apiRoute({ params }, async ({ db, actor, params, req }) => {
  const request = parseTileRequest(params.region, params.size);
  if (!request) throw new BadRequestError("Not a canonical IIIF tile request.");
  const { row } = await loadMicrograph(db, actor, params.micrographId, "read");
  if (row.status !== "ready") throw new AppError(409, "The deep-zoom pyramid is not ready yet.");
  const key = micrographKeys(row.dieId, row.id).pack;
  const store = objectStore();
  const pack = await openTilePack(store, key);
  if (!pack) throw new NotFoundError("That tile");
  const rel = resolveTilePath(request, pack.index.pyramid);
  const range = rel && tileRange(pack, rel);
  if (!rel || !range) throw new NotFoundError("That tile");
  // The next tiles of this pyramid for this session may take the fast path (server/http/fast-tiles.ts).
  approveTileReads(req.headers.get("cookie"), row.id, { description: pack.index.pyramid, open: (tile) => readTile(store, pack, tile) });
  const body = { size: range.length, open: async () => (await readTile(store, pack, rel))?.body ?? null };
  return serveImmutable(req, body, `${row.id}/${params.region}/${params.size}`, "image/jpeg");
});
