import "server-only";
import fs from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import type { MailboxEntry } from "@/lib/dto/mailbox";

/** One stored message as the mailbox index lists it. */

/** Where the index of stored messages lives inside the mail folder. */
const INDEX_FILE = "index.json";

function readIndex(dir: string): MailboxEntry[] {
  try {
    return JSON.parse(fs.readFileSync(path.join(dir, INDEX_FILE), "utf8")) as MailboxEntry[];
  } catch {
    return [];
  }
}

let writing: Promise<void> = Promise.resolve();

/** Appends to the index through a temp file and rename, one write at a time, so readers never see half a file. */
function appendIndex(dir: string, entry: MailboxEntry): Promise<void> {
  writing = writing.then(() => {
    const list = readIndex(dir);
    list.push(entry);
    const tmp = path.join(dir, `${INDEX_FILE}.${process.pid}.tmp`);
    fs.writeFileSync(tmp, JSON.stringify(list, null, 1));
    fs.renameSync(tmp, path.join(dir, INDEX_FILE));
  });
  return writing;
}

async function store(dir: string, raw: Buffer): Promise<void> {
  const parsed = await simpleParser(raw);
  const id = randomUUID();
  const file = `${new Date().toISOString().replace(/[:.]/g, "-")}-${id.slice(0, 8)}.eml`;
  fs.writeFileSync(path.join(dir, file), raw);
  const team = parsed.headers.get("x-kerfline-team");
  await appendIndex(dir, {
    id,
    file,
    subject: parsed.subject ?? "",
    from: parsed.from?.text ?? "",
    to: (Array.isArray(parsed.to) ? parsed.to.map((t) => t.text).join(", ") : parsed.to?.text) ?? "",
    date: (parsed.date ?? new Date()).toISOString(),
    teamId: typeof team === "string" ? team : null,
    messageId: parsed.messageId ?? null,
  });
}

/**
 * A local SMTP server on 127.0.0.1 that keeps every message it receives as an .eml file in
 * `dir` plus an index entry. Used when no real mail server is configured, so invitations and
 * notifications can be read on the mailbox page. Resolves with the port it listens on.
 */
export function startFakeSmtp(dir: string, port: number): Promise<{ port: number; close: () => Promise<void> }> {
  fs.mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        store(dir, Buffer.concat(chunks)).then(
          () => callback(),
          (e: Error) => callback(e),
        );
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => {
      const address = server.server.address();
      const bound = typeof address === "object" && address ? address.port : port;
      resolve({ port: bound, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}

/** The stored messages, newest first. */
export function listStoredMail(dir: string): MailboxEntry[] {
  return readIndex(dir).reverse();
}
