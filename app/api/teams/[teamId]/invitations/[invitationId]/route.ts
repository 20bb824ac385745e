import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { revokeInvitation } from "@/server/access/invitations";
import { uuidSchema } from "@/lib/validation/common";

/** Revokes a pending invitation (owner only): 204. */
export const DELETE = apiRoute({ params: z.object({ teamId: uuidSchema, invitationId: uuidSchema }) }, async ({ db, actor, params }) => {
  await revokeInvitation(db, actor, params.teamId, params.invitationId);
  return noContent();
});
