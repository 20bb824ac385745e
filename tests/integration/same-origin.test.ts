import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import { makeJpeg, uploadForm } from "../support/images";
import { square, type Thread } from "./review-support";

// Issue #13 item 5: a page on another origin — a sibling port of the same host included — must
// not change anything with the victim's cookie, whatever the body (multipart and body-less
// POSTs need no preflight, so the browser sends them straight away with Origin set).
let world: Awaited<ReturnType<typeof demoWorld>>;
let jpeg: Buffer;
const base = () => inject("baseUrl");
const sibling = () => {
  const u = new URL(base());
  return `${u.protocol}//${u.hostname}:${Number(u.port) + 1}`;
};

beforeAll(async () => {
  world = await demoWorld();
  jpeg = await makeJpeg(600, 400);
});

const incoming = () => {
  const dir = path.join(inject("dataDir"), "scratch", "incoming");
  return fs.existsSync(dir) ? fs.readdirSync(dir) : [];
};

async function openThread(dieId: string): Promise<Thread> {
  const t = await world.clients.reviewer.request<Thread>("POST", `/api/dies/${dieId}/threads`, { region: square(200, 200), body: "look here" });
  expect(t.status).toBe(201);
  return t.body;
}

describe("writes from another origin answer 403 and change nothing", () => {
  it("refuses a multipart upload whose Origin is a sibling port", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const before = incoming().length;
    const res = await world.clients.owner.upload<{ error: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(jpeg, "die.jpg"), { origin: sibling() });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/another site or port/);
    expect((await world.clients.owner.get<unknown[]>(`/api/dies/${dieId}/micrographs`)).body).toEqual([]);
    expect(incoming().length).toBe(before);
  });

  it("refuses a body-less POST (close a remark) from a sibling origin and from Sec-Fetch-Site: same-site", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await openThread(dieId);
    const refused: Record<string, string>[] = [
      { origin: sibling() },
      { origin: "null" },
      { "sec-fetch-site": "same-site" },
      { "sec-fetch-site": "cross-site" },
    ];
    for (const headers of refused) {
      const res = await world.clients.reviewer.request<{ error: string }>("POST", `/api/threads/${t.id}/resolve`, undefined, headers);
      expect(res.status, JSON.stringify(headers)).toBe(403);
      expect(res.body.error).toMatch(/another site or port/);
    }
    const now = await world.clients.reviewer.get<Thread[]>(`/api/dies/${dieId}/threads`);
    expect(now.body.find((x) => x.id === t.id)?.status).toBe("open");
  });

  it("refuses JSON, DELETE and Auth.js posts from another origin too", async () => {
    const { caseId } = await freshCase(world.clients.owner, world.teamId);
    const del = await world.clients.owner.request("DELETE", `/api/cases/${caseId}`, undefined, { origin: "http://attacker.test" });
    expect(del.status).toBe(403);
    expect((await world.clients.owner.get(`/api/cases/${caseId}`)).status).toBe(200);
    const patch = await world.clients.owner.request("PATCH", `/api/cases/${caseId}`, { title: "renamed" }, { origin: sibling() });
    expect(patch.status).toBe(403);
    const signOut = await fetch(`${base()}/api/auth/signout`, {
      method: "POST",
      redirect: "manual",
      headers: { origin: sibling(), cookie: world.clients.owner.cookie, "content-type": "application/x-www-form-urlencoded" },
      body: "csrfToken=x",
    });
    expect(signOut.status).toBe(403);
  });

  it("refuses a server action posted from another origin with 403 and a message", async () => {
    const res = await fetch(`${base()}/sign-in`, {
      method: "POST",
      redirect: "manual",
      headers: { origin: sibling(), "next-action": "0".repeat(40), "content-type": "text/plain;charset=UTF-8" },
      body: "[]",
    });
    expect(res.status).toBe(403);
    expect(((await res.json()) as { error: string }).error).toMatch(/another site or port/);
  });

  it("accepts the same writes from the app's own origin", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const t = await openThread(dieId);
    const res = await world.clients.reviewer.request<Thread>("POST", `/api/threads/${t.id}/resolve`, undefined, {
      origin: base(),
      "sec-fetch-site": "same-origin",
    });
    expect(res.status).toBe(200);
    const up = await world.clients.owner.upload(`/api/dies/${dieId}/micrographs`, uploadForm(jpeg, "die.jpg"), { origin: base() });
    expect(up.status).toBe(202);
  });
});
