import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { NotFoundError } from "@/lib/errors";
import { requireOwnedTeams } from "@/server/access/owned-teams";
import { isLocalMailMode } from "@/server/mail/local-mail";
import { mailboxFor, readStoredMail } from "@/server/mail/mailbox";
import { uuidSchema } from "@/lib/validation/common";

/** One stored message with its text and HTML parts (owners; local mode only). */
export const GET = apiRoute({ params: z.object({ messageId: uuidSchema }) }, async ({ db, actor, params }) => {
  if (!isLocalMailMode()) throw new NotFoundError("The mailbox");
  const entry = mailboxFor(await requireOwnedTeams(db, actor)).find((m) => m.id === params.messageId);
  if (!entry) throw new NotFoundError("That message");
  return readStoredMail(entry);
});
