import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { listMembers } from "@/db/access/teams";
import { uuidSchema } from "@/lib/validation/common";

export const GET = apiRoute({ params: z.object({ teamId: uuidSchema }) }, ({ db, actor, params }) =>
  listMembers(db, actor, params.teamId),
);
