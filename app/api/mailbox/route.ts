import { apiRoute } from "@/lib/server/route";
import { NotFoundError } from "@/lib/server/errors";
import { requireOwnedTeams } from "@/db/access/owned-teams";
import { isLocalMailMode } from "@/lib/server/mail/local-mail";
import { mailboxFor } from "@/lib/server/mail/mailbox";

/** Messages the local fake mail server received for the caller's teams (owners; local mode only). */
export const GET = apiRoute({}, async ({ db, actor }) => {
  if (!isLocalMailMode()) throw new NotFoundError("The mailbox (mail goes to the configured SMTP server)");
  return mailboxFor(await requireOwnedTeams(db, actor));
});
