import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { createInvitation, listInvitations } from "@/server/access/invitations";
import { publicOrigin } from "@/server/http/origin";
import { uuidSchema } from "@/lib/validation/common";
import { invitationSchema } from "@/lib/validation/review";

const params = z.object({ teamId: uuidSchema });

/** Pending invitations (owner only). */
export const GET = apiRoute({ params }, ({ db, actor, params }) => listInvitations(db, actor, params.teamId));

/** `{ email, role }` (owner only): 201; the single-use link is sent by e-mail only. */
export const POST = apiRoute({ params, body: invitationSchema }, async ({ db, actor, params, body, req }) =>
  created(await createInvitation(db, actor, params.teamId, body, publicOrigin(req))),
);
