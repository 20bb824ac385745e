import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listActivity } from "@/server/access/activity";
import { uuidSchema } from "@/lib/validation/common";
import { activityQuerySchema } from "@/lib/validation/review";

/** `{ items, nextBefore }`, newest first; pass `?before=<nextBefore>` for the next page. */
export const GET = apiRoute({ params: z.object({ dieId: uuidSchema }), query: activityQuerySchema }, ({ db, actor, params, query }) =>
  listActivity(db, actor, params.dieId, query),
);
