import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { getThread } from "@/db/access/threads";
import { uuidSchema } from "@/lib/validation/common";

export const GET = apiRoute({ params: z.object({ threadId: uuidSchema }) }, ({ db, actor, params }) => getThread(db, actor, params.threadId));
