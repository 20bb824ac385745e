import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { deleteCase, getCase, updateCase } from "@/server/access/cases";
import { casePatchSchema } from "@/lib/validation/cases";
import { uuidSchema } from "@/lib/validation/common";
import { removeDieFiles } from "@/server/files/die-files";

const params = z.object({ caseId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => getCase(db, actor, params.caseId));

export const PATCH = apiRoute({ params, body: casePatchSchema }, ({ db, actor, params, body }) => updateCase(db, actor, params.caseId, body));

export const DELETE = apiRoute({ params }, async ({ db, actor, params }) => {
  const { dieIds } = await deleteCase(db, actor, params.caseId);
  await removeDieFiles(dieIds);
  return noContent();
});
