import "server-only";
import type { Database } from "@/db/client";
import { env } from "../env";
import { startFakeSmtp } from "./fake-smtp";
import { isLocalMailMode, localMailState } from "./local-mail";
import { mailDir } from "./mailbox";
import { startMailSender } from "./sender";

/**
 * Starts mail for this process: without SMTP_URL a local fake mail server first (messages kept
 * under `<data dir>/mail/`), then the outbox sender.
 */
export async function startMail(db: Database): Promise<void> {
  if (isLocalMailMode()) {
    const state = localMailState();
    state.started ??= startFakeSmtp(mailDir(), env().KERFLINE_SMTP_PORT).then((s) => s.port);
    state.port = await state.started;
    console.log(`[kerfline] local mail server on 127.0.0.1:${state.port}; messages under ${mailDir()}`);
  }
  startMailSender(db);
}
