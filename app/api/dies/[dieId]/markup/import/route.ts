import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { importMarkup } from "@/server/access/markup-import";
import { uuidSchema } from "@/lib/validation/common";
import { MAX_IMPORT_BYTES } from "@/lib/export/geojson-import";

const params = z.object({ dieId: uuidSchema });
const query = z.strictObject({ dryRun: z.enum(["0", "1", "true", "false"], "dryRun must be 1 or 0").optional() });

/**
 * Imports a GeoJSON FeatureCollection of markup (as GET …/markup.geojson writes it): all or
 * nothing, 201 with what was added; `?dryRun=1` answers 200 with the same preview, writing nothing.
 */
export const POST = apiRoute({ params, query, body: z.unknown(), maxBodyBytes: MAX_IMPORT_BYTES }, async ({ db, actor, params, query, body }) => {
  const dryRun = query.dryRun === "1" || query.dryRun === "true";
  const result = await importMarkup(db, actor, params.dieId, body, dryRun);
  return dryRun ? Response.json(result) : created(result);
});
