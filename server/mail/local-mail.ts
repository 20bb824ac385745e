import "server-only";
import { env } from "../env";

type LocalMailState = { port?: number; started?: Promise<number> };

/** Shared by every bundle of this process (instrumentation and route handlers). */
export function localMailState(): LocalMailState {
  const g = globalThis as unknown as { __kerflineLocalMail?: LocalMailState };
  return (g.__kerflineLocalMail ??= {});
}

/** Local fake mail mode: no SMTP_URL configured, mail stays on this machine. */
export function isLocalMailMode(): boolean {
  return !env().SMTP_URL;
}
