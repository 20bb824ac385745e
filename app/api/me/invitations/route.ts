import { apiRoute } from "@/server/http/route";
import { listMyInvitations } from "@/server/access/invitations";

/** `{ items: [{ id, teamId, teamName, role, invitedBy, expiresAt, createdAt }] }`: pending invitations to the caller's address. */
export const GET = apiRoute({}, async ({ db, actor }) => ({ items: await listMyInvitations(db, actor) }));
