import { z } from "zod";
import { apiRoute, created } from "@/lib/server/route";
import { createCase } from "@/db/access/cases";
import { caseInputSchema } from "@/lib/validation/cases";
import { uuidSchema } from "@/lib/validation/common";

export const POST = apiRoute(
  { params: z.object({ teamId: uuidSchema }), body: caseInputSchema },
  async ({ db, actor, params, body }) => created(await createCase(db, actor, params.teamId, body)),
);
