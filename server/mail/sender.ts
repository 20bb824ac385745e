import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import type { Database } from "@/db/client";
import { claimDueMail, markMailFailed, markMailSent } from "@/server/access/outbox";
import { env } from "../env";
import { localMailState } from "./local-mail";

/** A claimed message is not taken by another sender for this long. */
const LEASE_MS = 60_000;
const FROM = "Kerfline <no-reply@kerfline.localhost>";

let cached: { url: string; transport: Transporter } | undefined;

async function transportUrl(): Promise<string> {
  const configured = env().SMTP_URL;
  if (configured) return configured;
  const port = await localMailState().started;
  return `smtp://127.0.0.1:${port}`;
}

async function transport(): Promise<Transporter> {
  const url = await transportUrl();
  if (cached?.url !== url) {
    cached = { url, transport: nodemailer.createTransport(url, { connectionTimeout: 5_000, greetingTimeout: 5_000, socketTimeout: 15_000 } as object) };
  }
  return cached.transport;
}

/** Most messages claimed per round; a full round goes again at once. */
const BATCH = 20;

/** Sends due messages once; returns how many were claimed. */
async function sendDueMail(db: Database): Promise<number> {
  const due = await claimDueMail(db, new Date(), LEASE_MS, BATCH);
  for (const row of due) {
    try {
      await (
        await transport()
      ).sendMail({
        from: FROM,
        to: row.toEmail,
        subject: row.subject,
        text: row.text,
        html: row.html,
        // One Message-ID per outbox row: a receiver can tell a retried copy from a new message.
        messageId: `<${row.id}@kerfline.localhost>`,
        headers: row.teamId ? { "X-Kerfline-Team": row.teamId } : {},
      });
      await markMailSent(db, row.id);
    } catch (e) {
      await markMailFailed(db, row, e instanceof Error ? e.message : String(e), env().KERFLINE_MAIL_RETRY_MS);
    }
  }
  return due.length;
}

/** The outbox sender: polls for due mail until stopped. Several processes may run one each. */
export function startMailSender(db: Database): () => void {
  let stopped = false;
  const loop = async () => {
    while (!stopped) {
      try {
        if ((await sendDueMail(db)) >= BATCH) continue;
      } catch (e) {
        console.error("[kerfline] mail sender:", e);
      }
      await new Promise((r) => setTimeout(r, env().KERFLINE_MAIL_POLL_MS));
    }
  };
  void loop();
  return () => {
    stopped = true;
  };
}
