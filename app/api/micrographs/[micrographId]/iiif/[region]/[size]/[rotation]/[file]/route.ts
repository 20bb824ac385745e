import fs from "node:fs";
import path from "node:path";
import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadMicrograph } from "@/server/access/micrographs";
import { uuidSchema } from "@/lib/validation/common";
import { micrographPaths } from "@/server/files/storage-paths";
import { parseTileRequest, resolveTilePath } from "@/lib/tiles/iiif";
import { readPyramidDescription } from "@/server/images/pyramid";
import { AppError, BadRequestError, NotFoundError } from "@/lib/errors";
import { serveImmutable } from "@/server/http/serve-file";
import { approveTileReads } from "@/server/http/fast-tiles";

// Every segment is validated: only canonical IIIF numbers reach the file system.
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
  const dir = micrographPaths(row.dieId, row.id).pyramid;
  const description = await readPyramidDescription(dir);
  const rel = resolveTilePath(request, description);
  if (!rel) throw new NotFoundError("That tile");
  approveTileReads(req.headers.get("cookie"), row.id, {
    description,
    open: async (r) => {
      const file = path.join(dir, r);
      const st = await fs.promises.stat(file).catch(() => null);
      return st ? { body: fs.createReadStream(file), size: st.size } : null;
    },
  });
  return serveImmutable(req, path.join(dir, rel), `${row.id}/${params.region}/${params.size}`, "image/jpeg");
});
