import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { getThread } from "@/server/access/threads";
import { uuidSchema } from "@/lib/validation/common";

export const GET = apiRoute({ params: z.object({ threadId: uuidSchema }) }, ({ db, actor, params }) => getThread(db, actor, params.threadId));
