import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { deleteMicrograph, getMicrograph, updateMicrograph } from "@/server/access/micrographs";
import { uuidSchema } from "@/lib/validation/common";
import { micrographPatchSchema } from "@/lib/validation/micrographs";
import { removeMicrographFiles } from "@/server/files/die-files";
import { withdrawTileReads } from "@/server/http/fast-tiles";

const params = z.object({ micrographId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => getMicrograph(db, actor, params.micrographId));

export const PATCH = apiRoute({ params, body: micrographPatchSchema }, ({ db, actor, params, body }) => updateMicrograph(db, actor, params.micrographId, body));

/**
 * Deletes the micrograph and then its files: original, pyramid, preview, thumbnail. This
 * process's fast tile path forgets its approvals at once (other web servers' lapse in 10 s).
 */
export const DELETE = apiRoute({ params }, async ({ db, actor, params }) => {
  const row = await deleteMicrograph(db, actor, params.micrographId);
  withdrawTileReads(row.id);
  await removeMicrographFiles(row.dieId, row.id, row.format);
  return noContent();
});
