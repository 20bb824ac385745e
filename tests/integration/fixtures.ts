import { inject } from "vitest";
import { demoClients, type ApiClient, type DemoUser } from "../support/client";

export type Who = DemoUser | "anonymous";
export const EVERYONE: Who[] = ["owner", "analyst", "reviewer", "viewer", "outsider", "anonymous"];

type Me = { user: { id: string }; teams: { id: string; name: string }[] };

/** Signed-in clients for every demo user and the demo team's ids. */
export async function demoWorld() {
  const clients = await demoClients(inject("baseUrl"));
  const me = (await clients.owner.get<Me>("/api/me")).body;
  const team = me.teams.find((t) => t.name === "Fjordlight Failure Lab")!;
  const outsiderTeam = (await clients.outsider.get<Me>("/api/me")).body.teams[0];
  const members = (await clients.owner.get<{ userId: string; email: string }[]>(`/api/teams/${team.id}/members`)).body;
  const userIds = Object.fromEntries(members.map((m) => [m.email.split("@")[0], m.userId])) as Record<string, string>;
  return { clients, teamId: team.id, outsiderTeamId: outsiderTeam.id, userIds };
}

/** A new case (and die) made by the owner, so each test mutates its own rows. */
export async function freshCase(owner: ApiClient, teamId: string, title = `Test case ${Math.random().toString(36).slice(2, 8)}`) {
  const c = await owner.request<{ id: string }>("POST", `/api/teams/${teamId}/cases`, {
    title,
    partMarking: "TP-1",
    package: "DIP-8",
    sampleId: "S-1",
    notes: "",
  });
  if (c.status !== 201) throw new Error(`could not create case: ${JSON.stringify(c.body)}`);
  const d = await owner.request<{ id: string }>("POST", `/api/cases/${c.body.id}/dies`, { name: "die 1", widthUm: 1000, heightUm: 800, notes: "" });
  if (d.status !== 201) throw new Error(`could not create die: ${JSON.stringify(d.body)}`);
  return { caseId: c.body.id, dieId: d.body.id };
}

/** The status a role gets for a right, per PRODUCT.md's role table (404 outside the team, 401 signed out). */
export function expectedStatus(who: Who, right: "read" | "edit" | "manage", ok: number): number {
  if (who === "anonymous") return 401;
  if (who === "outsider") return 404;
  const allowed = {
    read: ["owner", "analyst", "reviewer", "viewer"],
    edit: ["owner", "analyst"],
    manage: ["owner"],
  }[right];
  return allowed.includes(who) ? ok : 403;
}
