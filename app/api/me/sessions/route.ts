import { apiRoute, noContent } from "@/server/http/route";
import { endSessions } from "@/server/access/sessions";

/** Signs the caller out everywhere: every session issued so far, this one included, ends (204). */
export const DELETE = apiRoute({}, async ({ db, actor }) => {
  await endSessions(db, actor.userId);
  return noContent();
});
