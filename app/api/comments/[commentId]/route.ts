import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { deleteComment, editComment } from "@/server/access/comments";
import { publicOrigin } from "@/server/http/origin";
import { uuidSchema } from "@/lib/validation/common";
import { commentSchema } from "@/lib/validation/review";

const params = z.object({ commentId: uuidSchema });

/** `{ body }`: one's own comment only (403 otherwise); answers with the thread. */
export const PATCH = apiRoute({ params, body: commentSchema }, ({ db, actor, params, body, req }) =>
  editComment(db, actor, params.commentId, body.body, publicOrigin(req)),
);

/** 204; one's own comment only. */
export const DELETE = apiRoute({ params }, async ({ db, actor, params }) => {
  await deleteComment(db, actor, params.commentId);
  return noContent();
});
