import { apiRoute } from "@/server/http/route";
import { answerMyInvitation } from "@/server/access/invitations";
import { myInvitationParams } from "@/lib/validation/account";

/** Accept one of the caller's pending invitations: `{ teamId, joined }` (404 not theirs, 410 no longer pending). */
export const POST = apiRoute({ params: myInvitationParams }, ({ db, actor, params }) => answerMyInvitation(db, actor, params.invitationId, "accept"));
