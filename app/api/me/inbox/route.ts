import { apiRoute } from "@/server/http/route";
import { listInbox } from "@/server/access/inbox";

/** `{ items: [{ id, kind, dieId, threadId?, text, createdAt, readAt }] }`, newest first: the caller's own. */
export const GET = apiRoute({}, ({ db, actor }) => listInbox(db, actor));
