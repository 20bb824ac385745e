import { apiRoute } from "@/server/http/route";
import { markInboxItemRead } from "@/server/access/inbox";
import { inboxItemParams } from "@/lib/validation/account";

/** Marks one of the caller's inbox items read; answers the item (404 for anyone else's). */
export const POST = apiRoute({ params: inboxItemParams }, ({ db, actor, params }) => markInboxItemRead(db, actor, params.itemId));
