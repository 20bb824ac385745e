import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer, type RunningServer } from "../support/server";
import { ApiClient, DEMO_EMAILS, DEMO_PASSWORD, demoClients } from "../support/client";

// A server of its own: these tests end demo users' sessions and change their teams.
let server: RunningServer;
let clients: Awaited<ReturnType<typeof demoClients>>;
let teamId: string;
let userIds: Record<string, string>;
beforeAll(async () => {
  server = await startServer({ env: { KERFLINE_SEED: "demo-records" } });
  clients = await demoClients(server.url);
  const me = (await clients.owner.get<{ teams: { id: string; name: string }[] }>("/api/me")).body;
  teamId = me.teams.find((t) => t.name === "Fjordlight Failure Lab")!.id;
  const members = (await clients.owner.get<{ userId: string; email: string }[]>(`/api/teams/${teamId}/members`)).body;
  userIds = Object.fromEntries(members.map((m) => [m.email, m.userId]));
});
afterAll(() => server?.stop());

async function signedIn(email: string, password = DEMO_PASSWORD): Promise<ApiClient> {
  const c = new ApiClient(server.url);
  const to = await c.signIn(email, password);
  if (to.includes("error=")) throw new Error(`sign-in failed for ${email}: ${to}`);
  return c;
}

// Before sessions were versioned, a token copied before sign-out still got 200 for 12 hours.
describe("sessions end on the server", () => {
  it("refuses a token replayed after sign-out with 401, on the API, on pages and on Auth.js's session endpoint", async () => {
    const analyst = await signedIn(DEMO_EMAILS.analyst);
    const stolen = analyst.replay();
    expect((await stolen.get("/api/me")).status).toBe(200);
    expect(await analyst.signOut()).toBeLessThan(400);
    expect((await stolen.get("/api/me")).status).toBe(401);
    expect((await stolen.get("/api/me/inbox")).status).toBe(401);
    const page = await stolen.request("GET", "/cases");
    expect(page.status).toBeGreaterThanOrEqual(300);
    expect(page.status).toBeLessThan(400);
    expect(page.headers.get("location") ?? "").toContain("/sign-in");
    expect((await stolen.get<Record<string, unknown> | null>("/api/auth/session")).body ?? {}).not.toHaveProperty("user");
    // A new sign-in works as before.
    expect((await (await signedIn(DEMO_EMAILS.analyst)).get("/api/me")).status).toBe(200);
  });

  it("ends every session of the account with sign out everywhere", async () => {
    const laptop = await signedIn(DEMO_EMAILS.reviewer);
    const desk = await signedIn(DEMO_EMAILS.reviewer);
    expect((await desk.request("DELETE", "/api/me/sessions")).status).toBe(204);
    expect((await laptop.get("/api/me")).status).toBe(401);
    expect((await desk.get("/api/me")).status).toBe(401);
    expect((await clients.owner.get("/api/me")).status).toBe(200);
  });

  it("changes the password only with the current one, and then ends every session", async () => {
    const a = await signedIn(DEMO_EMAILS.viewer);
    const b = await signedIn(DEMO_EMAILS.viewer);
    const wrong = await a.request<{ error: string }>("POST", "/api/me/password", { currentPassword: "not-it", newPassword: "a-new-long-password" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error).toMatch(/currentPassword/);
    expect((await a.request("POST", "/api/me/password", { currentPassword: DEMO_PASSWORD, newPassword: "short" })).status).toBe(400);
    expect((await b.get("/api/me")).status).toBe(200);
    expect((await a.request("POST", "/api/me/password", { currentPassword: DEMO_PASSWORD, newPassword: "a-new-long-password" })).status).toBe(204);
    expect((await a.get("/api/me")).status).toBe(401);
    expect((await b.get("/api/me")).status).toBe(401);
    expect(await new ApiClient(server.url).signIn(DEMO_EMAILS.viewer)).toContain("error=");
    const again = await signedIn(DEMO_EMAILS.viewer, "a-new-long-password");
    expect((await again.request("POST", "/api/me/password", { currentPassword: "a-new-long-password", newPassword: DEMO_PASSWORD })).status).toBe(204);
  });

  it("ends a member's sessions when they are removed from a team; a role change applies at once without", async () => {
    const viewer = await signedIn(DEMO_EMAILS.viewer);
    const viewerId = userIds[DEMO_EMAILS.viewer];
    const members = `/api/teams/${teamId}/members/${viewerId}`;
    expect((await clients.owner.request("PATCH", members, { role: "reviewer" })).status).toBe(200);
    expect((await viewer.get<{ teams: { role: string }[] }>("/api/me")).body.teams[0].role).toBe("reviewer");
    expect((await clients.owner.request("PATCH", members, { role: "viewer" })).status).toBe(200);
    expect((await viewer.get<{ teams: { role: string }[] }>("/api/me")).body.teams[0].role).toBe("viewer");
    expect((await clients.owner.request("DELETE", members)).status).toBe(204);
    expect((await viewer.get("/api/me")).status).toBe(401);
  });
});

// Before: an existing user invited to another team joined it silently at the next sign-in.
describe("invitations to existing users", () => {
  type Mine = { items: { id: string; teamId: string; teamName: string; role: string; invitedBy: { name: string } | null }[] };

  async function invite(email: string, role: string) {
    const res = await clients.owner.request<{ id: string }>("POST", `/api/teams/${teamId}/invitations`, { email, role });
    expect(res.status).toBe(201);
    return res.body.id;
  }
  const teamsOf = async (c: ApiClient) => (await c.get<{ teams: { id: string; role: string }[] }>("/api/me")).body.teams;

  it("asks the invited user (team, role, inviter) and joins only on accept", async () => {
    const id = await invite(DEMO_EMAILS.outsider, "reviewer");
    const outsider = await signedIn(DEMO_EMAILS.outsider);
    expect((await teamsOf(outsider)).some((t) => t.id === teamId)).toBe(false);
    const mine = await outsider.get<Mine>("/api/me/invitations");
    expect(mine.status).toBe(200);
    expect(mine.body.items).toEqual([
      expect.objectContaining({
        id,
        teamId,
        teamName: "Fjordlight Failure Lab",
        role: "reviewer",
        invitedBy: expect.objectContaining({ name: expect.any(String) }),
      }),
    ]);
    // Nobody else can see or answer it (the analyst signs in afresh: an earlier test signed them out).
    const analyst = await signedIn(DEMO_EMAILS.analyst);
    expect((await analyst.get<Mine>("/api/me/invitations")).body.items.some((i) => i.id === id)).toBe(false);
    expect((await analyst.request("POST", `/api/me/invitations/${id}/accept`)).status).toBe(404);
    expect((await outsider.request<{ joined: boolean }>("POST", `/api/me/invitations/${id}/accept`)).body).toEqual({ teamId, joined: true });
    expect((await teamsOf(outsider)).find((t) => t.id === teamId)?.role).toBe("reviewer");
    expect((await outsider.request("POST", `/api/me/invitations/${id}/decline`)).status).toBe(410);
    expect((await outsider.get<Mine>("/api/me/invitations")).body.items).toEqual([]);
    expect((await clients.owner.request("DELETE", `/api/teams/${teamId}/members/${await outsiderId()}`)).status).toBe(204);
  });

  it("lets the invited user decline: nothing joined, the invitation closed and the link dead", async () => {
    const id = await invite(DEMO_EMAILS.outsider, "viewer");
    const outsider = await signedIn(DEMO_EMAILS.outsider);
    expect((await outsider.request<{ joined: boolean }>("POST", `/api/me/invitations/${id}/decline`)).body).toEqual({ teamId, joined: false });
    expect((await teamsOf(outsider)).some((t) => t.id === teamId)).toBe(false);
    expect((await clients.owner.get<{ id: string }[]>(`/api/teams/${teamId}/invitations`)).body.some((i) => i.id === id)).toBe(false);
    expect((await outsider.request("POST", `/api/me/invitations/${id}/accept`)).status).toBe(410);
    expect((await outsider.request("POST", "/api/me/invitations/not-a-uuid/accept")).status).toBe(400);
  });
});

async function outsiderId(): Promise<string> {
  const members = (await clients.owner.get<{ userId: string; email: string }[]>(`/api/teams/${teamId}/members`)).body;
  return members.find((m) => m.email === DEMO_EMAILS.outsider)!.userId;
}
