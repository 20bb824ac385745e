import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer, type RunningServer } from "../support/server";
import { demoClients, type ApiClient } from "../support/client";

// Removing members is destructive for the demo accounts, so it runs on a server of its own.
let server: RunningServer;
let owner: ApiClient;
let teamId: string;
let ids: Record<string, string>;

beforeAll(async () => {
  server = await startServer({ env: { KERFLINE_SEED: "demo-records" } });
  const clients = await demoClients(server.url);
  owner = clients.owner;
  teamId = (await owner.get<{ teams: { id: string }[] }>("/api/me")).body.teams[0].id;
  const members = (await owner.get<{ userId: string; email: string }[]>(`/api/teams/${teamId}/members`)).body;
  ids = Object.fromEntries(members.map((m) => [m.email.split("@")[0], m.userId]));
});
afterAll(() => server?.stop());

describe("team membership management by the owner", () => {
  it("removes a member, whose sessions end, and who then sees the team's cases as 404", async () => {
    const viewer = (await demoClients(server.url)).viewer;
    const list = await viewer.get<{ id: string }[]>("/api/cases");
    const caseId = list.body[0].id;
    expect((await owner.request("DELETE", `/api/teams/${teamId}/members/${ids.viewer}`)).status).toBe(204);
    expect((await viewer.get(`/api/cases/${caseId}`)).status).toBe(401);
    const again = (await demoClients(server.url)).viewer;
    expect((await again.get(`/api/cases/${caseId}`)).status).toBe(404);
    expect((await again.get<unknown[]>("/api/cases")).body).toEqual([]);
  });

  it("refuses to demote or remove the last owner and changes nothing", async () => {
    const demote = await owner.request<{ error: string }>("PATCH", `/api/teams/${teamId}/members/${ids.owner}`, { role: "analyst" });
    expect(demote.status).toBe(409);
    expect(demote.body.error).toMatch(/last owner/i);
    const remove = await owner.request<{ error: string }>("DELETE", `/api/teams/${teamId}/members/${ids.owner}`);
    expect(remove.status).toBe(409);
    const members = (await owner.get<{ userId: string; role: string }[]>(`/api/teams/${teamId}/members`)).body;
    expect(members.find((m) => m.userId === ids.owner)!.role).toBe("owner");
  });

  it("answers 404 for a member id that is not in the team and 400 for a bad role", async () => {
    const res = await owner.request("PATCH", `/api/teams/${teamId}/members/00000000-0000-4000-8000-000000000000`, { role: "viewer" });
    expect(res.status).toBe(404);
    const bad = await owner.request<{ error: string }>("PATCH", `/api/teams/${teamId}/members/${ids.reviewer}`, { role: "admin" });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/role/);
  });
  it("lets an owner step down once there is a second owner", async () => {
    expect((await owner.request("PATCH", `/api/teams/${teamId}/members/${ids.analyst}`, { role: "owner" })).status).toBe(200);
    expect((await owner.request("PATCH", `/api/teams/${teamId}/members/${ids.owner}`, { role: "reviewer" })).status).toBe(200);
  });
});
