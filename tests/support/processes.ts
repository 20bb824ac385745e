// Real processes for the scale-out tests: `npm run worker` (the same command line) and an SMTP
// server over a socket that records what it receives (smtp-server + mailparser).
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { freePort } from "./server";

const ROOT = path.resolve(import.meta.dirname, "../..");

export type Worker = { proc: ChildProcess; logs: () => string; exited: Promise<number> };

/** Starts `npm run worker`'s command with `env` (not waiting for it to be ready). */
export function spawnWorker(env: Record<string, string>): Worker {
  const proc = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(ROOT, "scripts/worker.ts")], {
    cwd: ROOT,
    env: { ...process.env, NODE_ENV: "production", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  proc.stdout!.on("data", (d) => (out += d));
  proc.stderr!.on("data", (d) => (out += d));
  const exited = new Promise<number>((resolve) => proc.once("exit", (code, signal) => resolve(code ?? (signal ? 128 : 1))));
  return { proc, logs: () => out, exited };
}

export type ReceivedMail = { to: string; subject: string; messageId: string };

/** An SMTP server on a free port that keeps every message it receives; `url` is an SMTP_URL. */
export async function startSmtpSink(): Promise<{ url: string; received: ReceivedMail[]; stop(): Promise<void> }> {
  const received: ReceivedMail[] = [];
  const port = await freePort();
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream).then(
        (m) => {
          const to = Array.isArray(m.to) ? m.to.map((t) => t.text).join(",") : (m.to?.text ?? "");
          received.push({ to, subject: m.subject ?? "", messageId: m.messageId ?? "" });
          callback();
        },
        (e: Error) => callback(e),
      );
    },
  });
  await new Promise<void>((r) => server.listen(port, "127.0.0.1", () => r()));
  return { url: `smtp://127.0.0.1:${port}`, received, stop: () => new Promise<void>((r) => server.close(() => r())) };
}
