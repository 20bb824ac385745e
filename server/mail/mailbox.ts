import "server-only";
import fs from "node:fs";
import path from "node:path";
import { simpleParser } from "mailparser";
import { dataPath } from "../env";
import { listStoredMail } from "./fake-smtp";
import type { MailboxEntry, StoredMessage } from "@/lib/dto/mailbox";

/** The folder the local fake mail server writes to: `<data dir>/mail/`. */
export function mailDir(): string {
  return path.dirname(dataPath("mail", "index.json"));
}

/** Stored messages of the given teams, newest first. */
export function mailboxFor(teamIds: readonly string[]): MailboxEntry[] {
  const mine = new Set(teamIds);
  return listStoredMail(mailDir()).filter((m) => m.teamId !== null && mine.has(m.teamId));
}

/** One stored message, parsed again from its .eml file. */
export async function readStoredMail(entry: MailboxEntry): Promise<StoredMessage> {
  const raw = fs.readFileSync(path.join(mailDir(), path.basename(entry.file)));
  const parsed = await simpleParser(raw);
  return { ...entry, text: parsed.text ?? "", html: typeof parsed.html === "string" ? parsed.html : null };
}
