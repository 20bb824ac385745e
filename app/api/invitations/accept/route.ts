import { apiRoute } from "@/server/http/route";
import { currentActor } from "@/server/http/session";
import { acceptInvitation } from "@/server/access/invitations";
import { acceptInvitationSchema } from "@/lib/validation/review";

/**
 * `{ token, name, password }` for a new person, or `{ token }` signed in as the invited
 * address: joins the team once (410 when used, revoked or expired).
 */
export const POST = apiRoute({ signedIn: false, body: acceptInvitationSchema }, async ({ db, body }) => acceptInvitation(db, await currentActor(), body));
