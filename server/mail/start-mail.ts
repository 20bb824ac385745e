import "server-only";
import { env } from "../env";
import { startFakeSmtp } from "./fake-smtp";
import { isLocalMailMode, localMailState } from "./local-mail";
import { mailDir } from "./mailbox";

/**
 * Starts the local fake mail server when SMTP_URL is unset (messages kept under
 * `<data dir>/mail/`); the outbox is sent by `mail` jobs (sender.ts).
 */
export async function startMail(): Promise<void> {
  if (isLocalMailMode()) {
    const state = localMailState();
    state.started ??= startFakeSmtp(mailDir(), env().KERFLINE_SMTP_PORT).then((s) => s.port);
    state.port = await state.started;
    console.log(`[kerfline] local mail server on 127.0.0.1:${state.port}; messages under ${mailDir()}`);
  }
}
