import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { createCase } from "@/server/access/cases";
import { caseInputSchema } from "@/lib/validation/cases";
import { uuidSchema } from "@/lib/validation/common";

export const POST = apiRoute({ params: z.object({ teamId: uuidSchema }), body: caseInputSchema }, async ({ db, actor, params, body }) =>
  created(await createCase(db, actor, params.teamId, body)),
);
