import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { setThreadStatus } from "@/server/access/threads";
import { uuidSchema } from "@/lib/validation/common";

/** Resolves the thread (409 when it already is); the answer says who resolved it and when. */
export const POST = apiRoute({ params: z.object({ threadId: uuidSchema }) }, ({ db, actor, params }) =>
  setThreadStatus(db, actor, params.threadId, "resolved"),
);
