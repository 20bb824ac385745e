import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { square, waitForMail } from "./review-support";
import { DEMO_EMAILS } from "../support/client";

type Item = { id: string; kind: string; dieId: string; threadId?: string; text: string; createdAt: string; readAt: string | null };
type Inbox = { items: Item[] };

let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

const inboxOf = async (who: "owner" | "analyst" | "reviewer" | "viewer" | "outsider") => (await world.clients[who].get<Inbox>("/api/me/inbox")).body.items;

// Before the inbox, only owners could read mail in the local mailbox: an analyst never saw the
// mention mailed to them.
describe("GET /api/me/inbox", () => {
  it("lists a mention for the mentioned user alone, linking to the exact remark, and the mail still goes out", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await world.clients.reviewer.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, {
      region: square(50, 50),
      body: "@Demo Analyst is this the bond pad for VDD?",
    });
    expect(t.status).toBe(201);
    const items = (await inboxOf("analyst")).filter((i) => i.threadId === t.body.id);
    expect(items).toHaveLength(1);
    const [item] = items;
    expect(Object.keys(item).sort()).toEqual(["createdAt", "dieId", "id", "kind", "readAt", "text", "threadId"]);
    expect(item).toMatchObject({ kind: "mention", dieId, threadId: t.body.id, readAt: null });
    expect(item.text).toContain("named you in a remark");
    expect(item.text).toContain("is this the bond pad for VDD?");
    expect(Number.isNaN(Date.parse(item.createdAt))).toBe(false);
    for (const other of ["owner", "viewer", "outsider", "reviewer"] as const) {
      expect((await inboxOf(other)).some((i) => i.threadId === t.body.id && i.kind === "mention")).toBe(false);
    }
    const mail = await waitForMail(world.clients.owner, DEMO_EMAILS.analyst, (m) => m.subject.includes("named you in a remark"), `?thread=${t.body.id}`);
    expect(mail.text).toContain(`/dies/${dieId}?thread=${t.body.id}`);
  });

  it("lists replies for the thread's people and review events without a thread", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await world.clients.reviewer.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, { region: square(10, 10), body: "first" });
    expect((await world.clients.analyst.request("POST", `/api/threads/${t.body.id}/comments`, { body: "answered on the pad table" })).status).toBe(201);
    const reply = (await inboxOf("reviewer")).find((i) => i.threadId === t.body.id);
    expect(reply).toMatchObject({ kind: "comment", dieId });
    expect(reply!.text).toContain("answered on the pad table");
    expect((await world.clients.owner.request("POST", `/api/dies/${dieId}/review`, { action: "send", message: "ready for a look" })).status).toBe(200);
    const review = (await inboxOf("reviewer")).find((i) => i.dieId === dieId && i.kind === "review_submitted");
    expect(review).toBeDefined();
    expect(review).not.toHaveProperty("threadId");
    expect(review!.text).toContain("ready for a look");
    // The one who acted hears nothing of their own action.
    expect((await inboxOf("owner")).some((i) => i.dieId === dieId && i.kind === "review_submitted")).toBe(false);
  });

  it("answers 401 signed out", async () => {
    expect((await world.clients.anonymous.get("/api/me/inbox")).status).toBe(401);
  });
});

describe("POST /api/me/inbox/{id}/read", () => {
  it("marks the caller's own item read once, and answers 404 for anyone else's", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await world.clients.owner.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, { region: square(10, 10), body: "@Demo Viewer fyi" });
    const item = (await inboxOf("viewer")).find((i) => i.threadId === t.body.id)!;
    expect(item.readAt).toBeNull();
    for (const who of ["analyst", "outsider"] as const) {
      expect((await world.clients[who].request("POST", `/api/me/inbox/${item.id}/read`)).status).toBe(404);
    }
    expect((await world.clients.anonymous.request("POST", `/api/me/inbox/${item.id}/read`)).status).toBe(401);
    expect((await inboxOf("viewer")).find((i) => i.id === item.id)!.readAt).toBeNull();
    const read = await world.clients.viewer.request<Item>("POST", `/api/me/inbox/${item.id}/read`);
    expect(read.status).toBe(200);
    expect(read.body.id).toBe(item.id);
    expect(read.body.readAt).not.toBeNull();
    const again = await world.clients.viewer.request<Item>("POST", `/api/me/inbox/${item.id}/read`);
    expect(again.body.readAt).toBe(read.body.readAt);
    expect((await world.clients.viewer.request("POST", "/api/me/inbox/not-a-uuid/read")).status).toBe(400);
  });
});
