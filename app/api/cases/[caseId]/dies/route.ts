import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { createDie, listDies } from "@/server/access/dies";
import { dieInputSchema } from "@/lib/validation/dies";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ caseId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => listDies(db, actor, params.caseId));

export const POST = apiRoute({ params, body: dieInputSchema }, async ({ db, actor, params, body }) => created(await createDie(db, actor, params.caseId, body)));
