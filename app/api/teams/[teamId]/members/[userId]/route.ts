import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { changeRole, removeMember } from "@/server/access/teams";
import { uuidSchema } from "@/lib/validation/common";
import { memberPatchSchema } from "@/lib/validation/teams";

const params = z.object({ teamId: uuidSchema, userId: uuidSchema });

export const PATCH = apiRoute({ params, body: memberPatchSchema }, ({ db, actor, params, body }) =>
  changeRole(db, actor, params.teamId, params.userId, body.role),
);

export const DELETE = apiRoute({ params }, async ({ db, actor, params }) => {
  await removeMember(db, actor, params.teamId, params.userId);
  return noContent();
});
