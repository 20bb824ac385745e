import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { setThreadStatus } from "@/server/access/threads";
import { uuidSchema } from "@/lib/validation/common";

/** Reopens a resolved thread (409 when it is open). */
export const POST = apiRoute({ params: z.object({ threadId: uuidSchema }) }, ({ db, actor, params }) => setThreadStatus(db, actor, params.threadId, "open"));
