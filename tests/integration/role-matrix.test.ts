import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, EVERYONE, expectedStatus, freshCase } from "./fixtures";

// Every route of the foundation against every role of PRODUCT.md's table, plus the signed-out
// caller and a member of another team; on every refusal nothing may change.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

describe("GET /api/me and GET /api/cases", () => {
  for (const who of EVERYONE) {
    it(`answers ${who === "anonymous" ? 401 : 200} for ${who}`, async () => {
      const me = await world.clients[who].get("/api/me");
      expect(me.status).toBe(who === "anonymous" ? 401 : 200);
      const list = await world.clients[who].get<{ title: string }[]>("/api/cases");
      expect(list.status).toBe(who === "anonymous" ? 401 : 200);
      if (who === "outsider") expect(list.body.map((c) => c.title)).not.toContain("NV-24R receiver teardown");
      if (["owner", "analyst", "reviewer", "viewer"].includes(who)) expect(list.body.map((c) => c.title)).toContain("NV-24R receiver teardown");
    });
  }
});

describe("POST /api/teams/{teamId}/cases", () => {
  for (const who of EVERYONE) {
    const want = expectedStatus(who, "edit", 201);
    it(`answers ${want} for ${who}`, async () => {
      const before = (await world.clients.owner.get<unknown[]>("/api/cases")).body.length;
      const res = await world.clients[who].request("POST", `/api/teams/${world.teamId}/cases`, { title: `by ${who}` });
      expect(res.status).toBe(want);
      const after = (await world.clients.owner.get<unknown[]>("/api/cases")).body.length;
      expect(after).toBe(before + (want === 201 ? 1 : 0));
      if (want !== 201) expect(typeof (res.body as { error: string }).error).toBe("string");
    });
  }
});

describe("GET|PATCH|DELETE /api/cases/{caseId}", () => {
  for (const who of EVERYONE) {
    it(`answers read ${expectedStatus(who, "read", 200)}, patch ${expectedStatus(who, "edit", 200)}, delete ${expectedStatus(who, "edit", 204)} for ${who}`, async () => {
      const { caseId } = await freshCase(world.clients.owner, world.teamId);
      const original = (await world.clients.owner.get(`/api/cases/${caseId}`)).body;
      expect((await world.clients[who].get(`/api/cases/${caseId}`)).status).toBe(expectedStatus(who, "read", 200));
      const patch = await world.clients[who].request("PATCH", `/api/cases/${caseId}`, { title: "renamed" });
      expect(patch.status).toBe(expectedStatus(who, "edit", 200));
      const afterPatch = (await world.clients.owner.get<{ title: string }>(`/api/cases/${caseId}`)).body;
      if (patch.status === 200) expect(afterPatch.title).toBe("renamed");
      else expect(afterPatch).toEqual(original);
      const del = await world.clients[who].request("DELETE", `/api/cases/${caseId}`);
      expect(del.status).toBe(expectedStatus(who, "edit", 204));
      expect((await world.clients.owner.get(`/api/cases/${caseId}`)).status).toBe(del.status === 204 ? 404 : 200);
    });
  }
});

describe("GET|POST /api/cases/{caseId}/dies", () => {
  for (const who of EVERYONE) {
    it(`answers list ${expectedStatus(who, "read", 200)}, create ${expectedStatus(who, "edit", 201)} for ${who}`, async () => {
      const { caseId } = await freshCase(world.clients.owner, world.teamId);
      expect((await world.clients[who].get(`/api/cases/${caseId}/dies`)).status).toBe(expectedStatus(who, "read", 200));
      const res = await world.clients[who].request("POST", `/api/cases/${caseId}/dies`, { name: `die by ${who}`, widthUm: 500, heightUm: 400 });
      expect(res.status).toBe(expectedStatus(who, "edit", 201));
      const dies = (await world.clients.owner.get<{ name: string; reviewStatus: string }[]>(`/api/cases/${caseId}/dies`)).body;
      expect(dies.length).toBe(res.status === 201 ? 2 : 1);
      expect(dies.every((d) => d.reviewStatus === "draft")).toBe(true);
    });
  }
});

describe("GET|PATCH|DELETE /api/dies/{dieId}", () => {
  for (const who of EVERYONE) {
    it(`answers read ${expectedStatus(who, "read", 200)}, patch ${expectedStatus(who, "edit", 200)}, delete ${expectedStatus(who, "edit", 204)} for ${who}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      const original = (await world.clients.owner.get(`/api/dies/${dieId}`)).body;
      expect((await world.clients[who].get(`/api/dies/${dieId}`)).status).toBe(expectedStatus(who, "read", 200));
      const patch = await world.clients[who].request("PATCH", `/api/dies/${dieId}`, { widthUm: 2400.5 });
      expect(patch.status).toBe(expectedStatus(who, "edit", 200));
      const afterPatch = (await world.clients.owner.get<{ widthUm: number }>(`/api/dies/${dieId}`)).body;
      if (patch.status === 200) expect(afterPatch.widthUm).toBe(2400.5);
      else expect(afterPatch).toEqual(original);
      const del = await world.clients[who].request("DELETE", `/api/dies/${dieId}`);
      expect(del.status).toBe(expectedStatus(who, "edit", 204));
      expect((await world.clients.owner.get(`/api/dies/${dieId}`)).status).toBe(del.status === 204 ? 404 : 200);
    });
  }
});

describe("team members (refusals; the owner's removals run on their own server in team-members.test.ts)", () => {
  for (const who of EVERYONE) {
    it(`answers list ${expectedStatus(who, "read", 200)} and role change ${expectedStatus(who, "manage", 200)} for ${who}`, async () => {
      const path = `/api/teams/${world.teamId}/members`;
      expect((await world.clients[who].get(path)).status).toBe(expectedStatus(who, "read", 200));
      const viewerId = world.userIds.viewer;
      const res = await world.clients[who].request("PATCH", `${path}/${viewerId}`, { role: "reviewer" });
      expect(res.status).toBe(expectedStatus(who, "manage", 200));
      const members = (await world.clients.owner.get<{ userId: string; role: string }[]>(path)).body;
      expect(members.find((m) => m.userId === viewerId)!.role).toBe(res.status === 200 ? "reviewer" : "viewer");
      await world.clients.owner.request("PATCH", `${path}/${viewerId}`, { role: "viewer" });
      if (who !== "owner") {
        const del = await world.clients[who].request("DELETE", `${path}/${world.userIds.reviewer}`);
        expect(del.status).toBe(expectedStatus(who, "manage", 204));
        expect((await world.clients.owner.get<unknown[]>(path)).body.length).toBe(members.length);
      }
    });
  }
});
