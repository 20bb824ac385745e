import { apiRoute } from "@/lib/server/route";
import { currentActor } from "@/lib/server/session";
import { acceptInvitation } from "@/db/access/invitations";
import { acceptInvitationSchema } from "@/lib/validation/review";

/**
 * `{ token, name, password }` for a new person, or `{ token }` signed in as the invited
 * address: joins the team once (410 when used, revoked or expired).
 */
export const POST = apiRoute({ signedIn: false, body: acceptInvitationSchema }, async ({ db, body }) =>
  acceptInvitation(db, await currentActor(), body),
);
