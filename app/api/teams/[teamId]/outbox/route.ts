import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listTeamOutbox } from "@/server/access/outbox";
import { uuidSchema } from "@/lib/validation/common";

/** The team's recent mail with delivery state and last error (owner only). */
export const GET = apiRoute({ params: z.object({ teamId: uuidSchema }) }, ({ db, actor, params }) => listTeamOutbox(db, actor, params.teamId));
