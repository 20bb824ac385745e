import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import type { Database } from "@/db/client";
import { markMailFailed, markMailGivenUp, markMailSent, pendingMail } from "@/server/access/outbox";
import { mailRetryDelaySeconds } from "../jobs/boss";
import type { JobHandler } from "../jobs/worker";
import { env } from "../env";
import { localMailState } from "./local-mail";

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

/**
 * Sends one outbox message, the job of a `mail` job. pg-boss hands a job to one worker at a
 * time (its fetch takes rows with FOR UPDATE SKIP LOCKED), and the message has one job, so it
 * goes out once whatever the number of processes. A failed attempt is recorded on the row and
 * thrown back, so pg-boss retries it with back-off.
 */
async function deliverMail(db: Database, outboxId: string): Promise<void> {
  const row = await pendingMail(db, outboxId);
  if (!row) return; // sent by an earlier attempt that died before finishing its job, or given up
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
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    await markMailFailed(db, row, message, mailRetryDelaySeconds() * 1000);
    throw e;
  }
  await markMailSent(db, row.id);
}

export const mailDelivery: JobHandler = {
  kind: "mail",
  run: deliverMail,
  failure: (e) => (e instanceof Error ? e.message : String(e)),
  markFailed: markMailGivenUp,
  exhausted: "The message was not sent: every attempt stopped before the mail server answered.",
};
