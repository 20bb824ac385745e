import { apiRoute } from "@/server/http/route";
import { NotFoundError } from "@/lib/errors";
import { requireOwnedTeams } from "@/server/access/owned-teams";
import { isLocalMailMode } from "@/server/mail/local-mail";
import { mailboxFor } from "@/server/mail/mailbox";

/** Messages the local fake mail server received for the caller's teams (owners; local mode only). */
export const GET = apiRoute({}, async ({ db, actor }) => {
  if (!isLocalMailMode()) throw new NotFoundError("The mailbox (mail goes to the configured SMTP server)");
  return mailboxFor(await requireOwnedTeams(db, actor));
});
