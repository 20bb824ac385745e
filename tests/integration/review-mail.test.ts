import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { freePort, startServer, type RunningServer } from "../support/server";
import { ApiClient, DEMO_EMAILS, demoClients } from "../support/client";
import { square } from "./review-support";

// A server of its own, sending to a real SMTP server this test starts and stops: mail must
// survive the mail server being down (outbox with retries) and arrive once it is back, once.
type Received = { to: string; subject: string; text: string; messageId: string };
let smtpPort: number;
let smtp: SMTPServer | null = null;
const received: Received[] = [];

function startSmtp(): Promise<void> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream).then(
        (m) => {
          received.push({
            to: Array.isArray(m.to) ? m.to.map((t) => t.text).join(",") : (m.to?.text ?? ""),
            subject: m.subject ?? "",
            text: m.text ?? "",
            messageId: m.messageId ?? "",
          });
          callback();
        },
        (e: Error) => callback(e),
      );
    },
  });
  smtp = server;
  return new Promise((resolve) => server.listen(smtpPort, "127.0.0.1", () => resolve()));
}

function stopSmtp(): Promise<void> {
  const s = smtp;
  smtp = null;
  return new Promise((resolve) => (s ? s.close(() => resolve()) : resolve()));
}

async function until<T>(what: string, probe: () => Promise<T | undefined | false>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

let server: RunningServer;
let clients: Awaited<ReturnType<typeof demoClients>>;
let teamId: string;

beforeAll(async () => {
  smtpPort = await freePort();
  server = await startServer({
    env: {
      KERFLINE_SEED: "demo-records",
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      KERFLINE_MAIL_RETRY_MS: "400",
      KERFLINE_MAIL_POLL_MS: "200",
      KERFLINE_INVITATION_TTL_SECONDS: "5",
    },
  });
  clients = await demoClients(server.url);
  teamId = (await clients.owner.get<{ teams: { id: string; name: string }[] }>("/api/me")).body.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
});

afterAll(async () => {
  await stopSmtp();
  await server?.stop();
});

type OutboxItem = { toEmail: string; subject: string; status: string; attempts: number; lastError: string | null };

describe("the mail outbox", () => {
  it("saves a comment while the mail server is down, retries, and delivers exactly once when it is back", async () => {
    const c = await clients.owner.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, { title: "Mail outage case" });
    const d = await clients.analyst.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "outage die", widthUm: 1000, heightUm: 800 });
    const t = await clients.reviewer.request<{ id: string; comments: { body: string }[] }>("POST", `/api/dies/${d.body.id}/threads`, {
      region: square(100, 100),
      body: "@Demo Analyst the VB2 pad looks lifted",
    });
    expect(t.status).toBe(201);
    expect(t.body.comments[0].body).toContain("VB2 pad");

    const failing = await until("failed attempts", async () => {
      const box = (await clients.owner.get<OutboxItem[]>(`/api/teams/${teamId}/outbox`)).body;
      const item = box.find((o) => o.toEmail === DEMO_EMAILS.analyst);
      return item && item.attempts >= 2 ? item : undefined;
    });
    expect(failing.status).toBe("pending");
    expect(failing.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(received).toEqual([]);

    await startSmtp();
    await until("delivery", async () => received.some((m) => m.to.includes(DEMO_EMAILS.analyst)));
    const sent = await until("sent state", async () => {
      const box = (await clients.owner.get<OutboxItem[]>(`/api/teams/${teamId}/outbox`)).body;
      return box.find((o) => o.toEmail === DEMO_EMAILS.analyst && o.status === "sent");
    });
    expect(sent.lastError).toBeNull();
    // A few more sender rounds must not send it again.
    await new Promise((r) => setTimeout(r, 1500));
    const copies = received.filter((m) => m.to.includes(DEMO_EMAILS.analyst));
    expect(copies.length).toBe(1);
    expect(copies[0].text).toContain(`/dies/${d.body.id}?thread=${t.body.id}`);
  });

  it("refuses an expired invitation link with 410", async () => {
    if (!smtp) await startSmtp();
    const email = "late-invitee@fjordlight.test";
    expect((await clients.owner.request("POST", `/api/teams/${teamId}/invitations`, { email, role: "reviewer" })).status).toBe(201);
    const mail = await until("the invitation mail", async () => received.find((m) => m.to.includes(email)));
    const token = /\/invitations\/([A-Za-z0-9_-]{20,})/.exec(mail.text)![1];
    await new Promise((r) => setTimeout(r, 5_500));
    const res = await new ApiClient(server.url).request<{ error: string }>("POST", "/api/invitations/accept", {
      token,
      name: "Late",
      password: "a-long-password",
    });
    expect(res.status).toBe(410);
    expect(res.body.error).toMatch(/expired/);
  });

  it("asks an existing user instead of joining them at sign-in", async () => {
    // Invitations on this server expire in 5 s: sign in (slow, bcrypt) before inviting, so the
    // invitation is answered well inside that time on a busy machine.
    const outsider = new ApiClient(server.url);
    await outsider.signIn(DEMO_EMAILS.outsider);
    expect((await clients.owner.request("POST", `/api/teams/${teamId}/invitations`, { email: DEMO_EMAILS.outsider, role: "viewer" })).status).toBe(201);
    expect((await outsider.get<{ teams: { id: string }[] }>("/api/me")).body.teams.some((t) => t.id === teamId)).toBe(false);
    const [invitation] = (await outsider.get<{ items: { id: string; teamId: string; role: string }[] }>("/api/me/invitations")).body.items;
    expect(invitation).toMatchObject({ teamId, role: "viewer" });
    expect((await outsider.request("POST", `/api/me/invitations/${invitation.id}/accept`)).status).toBe(200);
    const me = (await outsider.get<{ teams: { id: string; role: string }[] }>("/api/me")).body;
    expect(me.teams.find((t) => t.id === teamId)?.role).toBe("viewer");
  });
});
