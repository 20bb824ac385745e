import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadMicrograph } from "@/server/access/micrographs";
import { uuidSchema } from "@/lib/validation/common";
import { micrographKeys } from "@/server/storage/keys";
import { objectStore } from "@/server/storage";
import { openTilePack } from "@/server/storage/tile-pack";
import { buildInfoJson } from "@/lib/tiles/iiif";
import { AppError, NotFoundError } from "@/lib/errors";
import { publicOrigin } from "@/server/http/origin";

const params = z.object({ micrographId: uuidSchema });

/** The IIIF Image API 3.0 description of a micrograph's pyramid; `id` is the service's absolute URL. */
export const GET = apiRoute({ params }, async ({ db, actor, params, req }) => {
  const { row } = await loadMicrograph(db, actor, params.micrographId, "read");
  if (row.status !== "ready") {
    throw new AppError(409, `The deep-zoom pyramid is not ready yet (${row.status}, ${row.progress} %).`, { status: row.status, progress: row.progress });
  }
  const pack = await openTilePack(objectStore(), micrographKeys(row.dieId, row.id).pack);
  if (!pack) throw new NotFoundError("That micrograph's pyramid");
  const info = buildInfoJson({ id: `${publicOrigin(req)}/api/micrographs/${row.id}/iiif`, ...pack.index.pyramid });
  return Response.json(info, {
    headers: { "content-type": 'application/ld+json;profile="http://iiif.io/api/image/3/context.json"', "cache-control": "private, no-cache" },
  });
});
