import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listMembers } from "@/server/access/teams";
import { uuidSchema } from "@/lib/validation/common";

export const GET = apiRoute({ params: z.object({ teamId: uuidSchema }) }, ({ db, actor, params }) => listMembers(db, actor, params.teamId));
