import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { addComment } from "@/server/access/comments";
import { publicOrigin } from "@/server/http/origin";
import { uuidSchema } from "@/lib/validation/common";
import { commentSchema } from "@/lib/validation/review";

/** `{ body }`: 201 with the thread as it is now. */
export const POST = apiRoute({ params: z.object({ threadId: uuidSchema }), body: commentSchema }, async ({ db, actor, params, body, req }) =>
  created(await addComment(db, actor, params.threadId, body.body, publicOrigin(req))),
);
