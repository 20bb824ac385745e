import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { deleteDie, getDie, updateDie } from "@/server/access/dies";
import { diePatchSchema } from "@/lib/validation/dies";
import { uuidSchema } from "@/lib/validation/common";
import { removeDieFiles } from "@/server/files/die-files";

const params = z.object({ dieId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => getDie(db, actor, params.dieId));

export const PATCH = apiRoute({ params, body: diePatchSchema }, ({ db, actor, params, body }) => updateDie(db, actor, params.dieId, body));

export const DELETE = apiRoute({ params }, async ({ db, actor, params }) => {
  await deleteDie(db, actor, params.dieId);
  await removeDieFiles([params.dieId]);
  return noContent();
});
