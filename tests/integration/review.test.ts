import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, EVERYONE, freshCase, type Who } from "./fixtures";
import { addPad, square, waitForMail, invitationToken, type Thread } from "./review-support";
import { ApiClient, DEMO_EMAILS } from "../support/client";

// Threads, comments, review status and invitations against every role of PRODUCT.md's table,
// the signed-out caller and a member of another team. On every refusal nothing may change.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

/** PRODUCT.md "Roles": comment, reply, resolve — owner, analyst, reviewer. */
function commentStatus(who: Who, ok: number): number {
  if (who === "anonymous") return 401;
  if (who === "outsider") return 404;
  return ["owner", "analyst", "reviewer"].includes(who) ? ok : 403;
}
const readStatus = (who: Who) => (who === "anonymous" ? 401 : who === "outsider" ? 404 : 200);

async function threadsOf(dieId: string) {
  return (await world.clients.owner.get<Thread[]>(`/api/dies/${dieId}/threads`)).body;
}

async function newThread(dieId: string, body = "first comment") {
  const res = await world.clients.reviewer.request<Thread>("POST", `/api/dies/${dieId}/threads`, { region: square(200, 200), body });
  expect(res.status).toBe(201);
  return res.body;
}

describe("GET|POST /api/dies/{dieId}/threads", () => {
  for (const who of EVERYONE) {
    it(`answers read ${readStatus(who)}, create ${commentStatus(who, 201)} for ${who}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      expect((await world.clients[who].get(`/api/dies/${dieId}/threads`)).status).toBe(readStatus(who));
      const res = await world.clients[who].request("POST", `/api/dies/${dieId}/threads`, { region: square(10, 10), body: `by ${who}` });
      expect(res.status).toBe(commentStatus(who, 201));
      expect((await threadsOf(dieId)).length).toBe(res.status === 201 ? 1 : 0);
    });
  }

  it("anchors a thread on a shape to its geometry and marks it orphaned once the shape is deleted", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const shapeId = await addPad(world.clients.owner, dieId, 300, 400);
    const t = (await world.clients.reviewer.request<Thread>("POST", `/api/dies/${dieId}/threads`, { shapeId, body: "is this pad probed?" })).body;
    expect(t.shapeId).toBe(shapeId);
    expect(t.orphaned).toBe(false);
    // Centre of the 80 µm square pad at (300, 400), worked by hand.
    expect(t.pin).toEqual([340, 440]);
    expect((await world.clients.owner.request("DELETE", `/api/markup/${shapeId}`)).status).toBe(204);
    const [after] = await threadsOf(dieId);
    expect(after.orphaned).toBe(true);
    expect(after.pin).toEqual([340, 440]);
    expect(after.comments[0].body).toBe("is this pad probed?");
  });

  it("refuses bad bodies with 400 and writes nothing", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const bad = [
      {},
      { body: "no anchor" },
      { region: square(0, 0), body: "   " },
      { region: { type: "Point", coordinates: [1, 2] }, body: "x" },
      { region: square(50_000, 50_000), body: "outside the die" },
      { shapeId: "00000000-0000-4000-8000-000000000000", body: "no such shape" },
      { region: square(0, 0), body: "x", extra: 1 },
    ];
    for (const b of bad) {
      const res = await world.clients.reviewer.request<{ error: string }>("POST", `/api/dies/${dieId}/threads`, b);
      expect(res.status, JSON.stringify(b)).toBe(400);
      expect(typeof res.body.error).toBe("string");
    }
    expect(await threadsOf(dieId)).toEqual([]);
  });
});

describe("POST /api/threads/{id}/comments, resolve and reopen", () => {
  for (const who of EVERYONE) {
    it(`answers comment ${commentStatus(who, 201)}, resolve ${commentStatus(who, 200)}, reopen ${commentStatus(who, 200)} for ${who}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      const t = await newThread(dieId);
      const c = await world.clients[who].request("POST", `/api/threads/${t.id}/comments`, { body: "a reply" });
      expect(c.status).toBe(commentStatus(who, 201));
      const r = await world.clients[who].request<Thread>("POST", `/api/threads/${t.id}/resolve`);
      expect(r.status).toBe(commentStatus(who, 200));
      const [now] = await threadsOf(dieId);
      expect(now.comments.length).toBe(c.status === 201 ? 2 : 1);
      expect(now.status).toBe(r.status === 200 ? "resolved" : "open");
      if (r.status === 200) {
        expect(r.body.resolvedBy?.id).toBe(world.userIds[who]);
        expect(Date.now() - Date.parse(r.body.resolvedAt!)).toBeLessThan(60_000);
        expect((await world.clients[who].request("POST", `/api/threads/${t.id}/resolve`)).status).toBe(409);
      }
      const o = await world.clients[who].request("POST", `/api/threads/${t.id}/reopen`);
      expect(o.status).toBe(r.status === 200 ? 200 : commentStatus(who, 409));
    });
  }
});

describe("PATCH|DELETE /api/comments/{id}", () => {
  for (const who of EVERYONE) {
    const others = commentStatus(who, 403);
    it(`answers ${others} for ${who} on someone else's comment`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      const t = await newThread(dieId, "the reviewer's words");
      const id = t.comments[0].id;
      if (who === "reviewer") return;
      expect((await world.clients[who].request("PATCH", `/api/comments/${id}`, { body: "changed" })).status).toBe(others);
      expect((await world.clients[who].request("DELETE", `/api/comments/${id}`)).status).toBe(others);
      expect((await threadsOf(dieId))[0].comments[0].body).toBe("the reviewer's words");
    });
  }

  it("lets the author edit and delete their own comment", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await newThread(dieId, "typo");
    const id = t.comments[0].id;
    const p = await world.clients.reviewer.request<Thread>("PATCH", `/api/comments/${id}`, { body: "fixed" });
    expect(p.status).toBe(200);
    expect(p.body.comments[0].body).toBe("fixed");
    expect((await world.clients.reviewer.request("DELETE", `/api/comments/${id}`)).status).toBe(204);
    expect((await threadsOf(dieId))[0].comments).toEqual([]);
  });
});

describe("comment bodies", () => {
  // OWASP XSS Filter Evasion Cheat Sheet vectors and markdown image tricks.
  const corpus = [
    "<script>alert(1)</script>",
    '<img src=x onerror="alert(1)">',
    "[click](javascript:alert(1))",
    "![x](https://example.com/x.png)",
    "[x](data:text/html;base64,PHNjcmlwdD4=)",
    '<a href="javascript:alert(1)" onmouseover="alert(2)">hi</a>',
  ];
  it("stores the XSS corpus verbatim", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await newThread(dieId, corpus[0]);
    for (const body of corpus.slice(1)) expect((await world.clients.analyst.request("POST", `/api/threads/${t.id}/comments`, { body })).status).toBe(201);
    const [stored] = await threadsOf(dieId);
    expect(stored.comments.map((c) => c.body)).toEqual(corpus);
  });

  it("resolves mentions only to members of the die's team", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await newThread(dieId, "@Demo Analyst and @viewer@fjordlight.test, not @Demo Outsider nor @outsider@elsewhere.test");
    expect(t.comments[0].mentions.sort()).toEqual([world.userIds.analyst, world.userIds.viewer].sort());
  });
});

describe("GET /api/dies/{dieId}/activity", () => {
  it("lists markup, comments, resolves and review steps newest first, page by page", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    await addPad(world.clients.owner, dieId);
    const t = await newThread(dieId);
    await world.clients.reviewer.request("POST", `/api/threads/${t.id}/resolve`);
    await world.clients.owner.request("POST", `/api/dies/${dieId}/review`, { action: "send", message: "go" });
    type Page = { items: { id: string; action: string }[]; nextBefore: string | null };
    const seen: string[] = [];
    let before: string | null = null;
    do {
      const q: string = before ? `&before=${encodeURIComponent(before)}` : "";
      const page: { status: number; body: Page } = await world.clients.viewer.get<Page>(`/api/dies/${dieId}/activity?limit=2${q}`);
      expect(page.status).toBe(200);
      seen.push(...page.body.items.map((i) => i.action));
      before = page.body.nextBefore;
    } while (before);
    // A thread and its first comment are written in one transaction and share its time.
    expect(seen.slice(0, 2)).toEqual(["review.send", "thread.resolved"]);
    expect(seen.slice(2, 4).sort()).toEqual(["comment.created", "thread.created"]);
    expect(seen.slice(4)).toEqual(["markup.created", "die.created"]);
    expect((await world.clients.outsider.get(`/api/dies/${dieId}/activity`)).status).toBe(404);
  });
});

describe("invitations", () => {
  for (const who of EVERYONE) {
    const want = who === "anonymous" ? 401 : who === "outsider" ? 404 : who === "owner" ? 201 : 403;
    it(`answers create ${want} for ${who}`, async () => {
      const email = `invitee-${who}-${Math.random().toString(36).slice(2, 8)}@fjordlight.test`;
      const res = await world.clients[who].request("POST", `/api/teams/${world.teamId}/invitations`, { email, role: "reviewer" });
      expect(res.status).toBe(want);
      const pending = (await world.clients.owner.get<{ email: string }[]>(`/api/teams/${world.teamId}/invitations`)).body;
      expect(pending.some((p) => p.email === email)).toBe(want === 201);
      expect((await world.clients[who].get(`/api/teams/${world.teamId}/invitations`)).status).toBe(want === 201 ? 200 : want);
    });
  }

  it("mails a single-use link that lets a new person join with the invited role", async () => {
    const email = `new-${Math.random().toString(36).slice(2, 8)}@fjordlight.test`;
    expect((await world.clients.owner.request("POST", `/api/teams/${world.teamId}/invitations`, { email, role: "reviewer" })).status).toBe(201);
    const mail = await waitForMail(world.clients.owner, email, (m) => m.subject.includes("Invitation"));
    expect(mail.html).toContain("/invitations/");
    const token = invitationToken(mail);
    const anon = new ApiClient(world.clients.owner.baseUrl);
    expect((await anon.request("POST", "/api/invitations/accept", { token, name: "New Reviewer", password: "short" })).status).toBe(400);
    expect((await anon.request("POST", "/api/invitations/accept", { token, name: "New Reviewer", password: "a-long-password" })).status).toBe(200);
    const again = await anon.request<{ error: string }>("POST", "/api/invitations/accept", { token, name: "Someone Else", password: "another-password" });
    expect(again.status).toBe(410);
    expect(again.body.error).toMatch(/already been used/);
    const members = (await world.clients.owner.get<{ email: string; role: string }[]>(`/api/teams/${world.teamId}/members`)).body;
    expect(members.find((m) => m.email === email)?.role).toBe("reviewer");
    const signedIn = new ApiClient(world.clients.owner.baseUrl);
    expect(await signedIn.signIn(email, "a-long-password")).not.toContain("error=");
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    expect((await signedIn.request("POST", `/api/dies/${dieId}/threads`, { region: square(0, 0), body: "hello from the new reviewer" })).status).toBe(201);
  });

  it("stops a revoked link from working and lets only the owner revoke", async () => {
    const email = `revoked-${Math.random().toString(36).slice(2, 8)}@fjordlight.test`;
    const inv = (await world.clients.owner.request<{ id: string }>("POST", `/api/teams/${world.teamId}/invitations`, { email, role: "viewer" })).body;
    const token = invitationToken(await waitForMail(world.clients.owner, email, (m) => m.subject.includes("Invitation")));
    expect((await world.clients.analyst.request("DELETE", `/api/teams/${world.teamId}/invitations/${inv.id}`)).status).toBe(403);
    expect((await world.clients.outsider.request("DELETE", `/api/teams/${world.teamId}/invitations/${inv.id}`)).status).toBe(404);
    expect((await world.clients.owner.request("DELETE", `/api/teams/${world.teamId}/invitations/${inv.id}`)).status).toBe(204);
    const anon = new ApiClient(world.clients.owner.baseUrl);
    expect((await anon.request("POST", "/api/invitations/accept", { token, name: "Late", password: "a-long-password" })).status).toBe(410);
  });
});

describe("mail notifications", () => {
  it("mails the mentioned member with a deep link to the thread, and owners see the outbox", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await newThread(dieId, `please check, @Demo Analyst <b>now</b>`);
    const mail = await waitForMail(world.clients.owner, DEMO_EMAILS.analyst, (m) => m.subject.includes("named you in a remark"), `?thread=${t.id}`);
    expect(mail.text).toContain(`/dies/${dieId}?thread=${t.id}`);
    // The tag arrives as visible text (HTML Standard §13.1.2: "<" escaped, ">" may stay).
    expect(mail.html).toContain("&lt;b>now&lt;/b>");
    expect(mail.html).not.toContain("<b>");
    const outbox = await world.clients.owner.get<{ toEmail: string; status: string }[]>(`/api/teams/${world.teamId}/outbox`);
    expect(outbox.status).toBe(200);
    expect(outbox.body.some((o) => o.toEmail === DEMO_EMAILS.analyst && o.status === "sent")).toBe(true);
    expect((await world.clients.reviewer.get(`/api/teams/${world.teamId}/outbox`)).status).toBe(403);
    expect((await world.clients.analyst.get("/api/mailbox")).status).toBe(403);
    const outsiderBox = await world.clients.outsider.get<{ to: string }[]>("/api/mailbox");
    expect(outsiderBox.body.some((m) => m.to.includes("fjordlight"))).toBe(false);
  });

  it("sends nothing of a kind the user turned off", async () => {
    expect((await world.clients.viewer.request("PATCH", "/api/me/notifications", { mention: false })).status).toBe(200);
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    await newThread(dieId, "@Demo Viewer fyi");
    await new Promise((r) => setTimeout(r, 500));
    const outbox = (await world.clients.owner.get<{ toEmail: string; createdAt: string }[]>(`/api/teams/${world.teamId}/outbox`)).body;
    expect(outbox.some((o) => o.toEmail === DEMO_EMAILS.viewer && Date.parse(o.createdAt) > Date.now() - 5_000)).toBe(false);
    expect((await world.clients.viewer.get<{ mention: boolean }>("/api/me/notifications")).body.mention).toBe(false);
    await world.clients.viewer.request("PATCH", "/api/me/notifications", { mention: true });
  });
});
