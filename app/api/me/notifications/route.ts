import { apiRoute } from "@/server/http/route";
import { getNotificationPrefs, setNotificationPrefs } from "@/server/access/notification-prefs";
import { notificationPrefsSchema } from "@/lib/validation/review";

/** Which notification mails the caller receives. */
export const GET = apiRoute({}, ({ db, actor }) => getNotificationPrefs(db, actor));

/** `{ comment?, mention?, review_submitted?, review_decision? }` booleans. */
export const PATCH = apiRoute({ body: notificationPrefsSchema }, ({ db, actor, body }) => setNotificationPrefs(db, actor, body));
