import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import type { AnyShape } from "@/lib/markup/types";

// Issue #13 item 10: a client-chosen id taken in another team gets the same answer as one
// taken in the caller's own team (nothing tells that the shape exists elsewhere), and a wire
// bond's padId must name a pad of the same die.
let world: Awaited<ReturnType<typeof demoWorld>>;
const note = (id?: string) => ({ ...(id ? { id } : {}), kind: "note", geometry: { type: "Point", coordinates: [100, 100] }, properties: { text: "see here" } });
const pad = (id: string) => ({
  id,
  kind: "pad",
  geometry: {
    type: "Polygon",
    coordinates: [
      [
        [20, 20],
        [80, 20],
        [80, 80],
        [20, 80],
        [20, 20],
      ],
    ],
  },
  properties: { label: "VB1" },
});
const bond = (padId: string) => ({
  kind: "wire_bond",
  geometry: {
    type: "LineString",
    coordinates: [
      [50, 50],
      [50, 400],
    ],
  },
  properties: { diameterUm: 25, padId },
});

beforeAll(async () => {
  world = await demoWorld();
});

describe("client-chosen markup ids", () => {
  it("answers an id taken in another team exactly as one taken in the caller's own team", async () => {
    const mine = await freshCase(world.clients.owner, world.teamId);
    const theirs = await freshCase(world.clients.outsider, world.outsiderTeamId);
    const ownId = randomUUID();
    const foreignId = randomUUID();
    expect((await world.clients.owner.request("POST", `/api/dies/${mine.dieId}/markup`, note(ownId))).status).toBe(201);
    expect((await world.clients.outsider.request("POST", `/api/dies/${theirs.dieId}/markup`, note(foreignId))).status).toBe(201);

    const own = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${mine.dieId}/markup`, note(ownId));
    const foreign = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${mine.dieId}/markup`, note(foreignId));
    expect(foreign.status).toBe(own.status);
    expect(foreign.body.error.replace(foreignId, "ID")).toBe(own.body.error.replace(ownId, "ID"));
    expect(foreign.body.error).not.toMatch(/exists/);
    // Nothing was added to the caller's die, and the other team's shape is untouched.
    expect((await world.clients.owner.get<AnyShape[]>(`/api/dies/${mine.dieId}/markup`)).body).toHaveLength(1);
    expect((await world.clients.outsider.get<AnyShape>(`/api/markup/${foreignId}`)).body.properties).toEqual({ text: "see here" });
  });
});

describe("a wire bond's padId", () => {
  it("must name a pad of the same die: another die's pad, another team's pad or a note are refused with 400", async () => {
    const a = await freshCase(world.clients.owner, world.teamId);
    const b = await freshCase(world.clients.owner, world.teamId);
    const theirs = await freshCase(world.clients.outsider, world.outsiderTeamId);
    const padA = randomUUID();
    const padB = randomUUID();
    const padForeign = randomUUID();
    const noteA = randomUUID();
    expect((await world.clients.owner.request("POST", `/api/dies/${a.dieId}/markup`, [pad(padA), note(noteA)])).status).toBe(201);
    expect((await world.clients.owner.request("POST", `/api/dies/${b.dieId}/markup`, pad(padB))).status).toBe(201);
    expect((await world.clients.outsider.request("POST", `/api/dies/${theirs.dieId}/markup`, pad(padForeign))).status).toBe(201);

    for (const padId of [padB, padForeign, noteA, randomUUID()]) {
      const res = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${a.dieId}/markup`, bond(padId));
      expect(res.status, padId).toBe(400);
      expect(res.body.error).toMatch(/padId does not name a pad of this die/);
    }
    const batch = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${a.dieId}/markup`, [note(), bond(padB)]);
    expect(batch.status).toBe(400);
    expect(batch.body.error).toMatch(/1\.properties\.padId/);
    expect((await world.clients.owner.get<AnyShape[]>(`/api/dies/${a.dieId}/markup`)).body).toHaveLength(2);

    // The die's own pad, or one created in the same request, is accepted.
    expect((await world.clients.owner.request("POST", `/api/dies/${a.dieId}/markup`, bond(padA))).status).toBe(201);
    const fresh = randomUUID();
    expect((await world.clients.owner.request("POST", `/api/dies/${a.dieId}/markup`, [pad(fresh), bond(fresh)])).status).toBe(201);

    // A PATCH that points an existing bond at another die's pad is refused too.
    const shapes = (await world.clients.owner.get<AnyShape[]>(`/api/dies/${a.dieId}/markup`)).body;
    const stored = shapes.find((s) => s.kind === "wire_bond")!;
    const patch = await world.clients.owner.request<{ error: string }>("PATCH", `/api/markup/${stored.id}`, {
      version: stored.version,
      properties: { diameterUm: 25, padId: padB },
    });
    expect(patch.status).toBe(400);
    expect(patch.body.error).toMatch(/padId does not name a pad of this die/);
  });
});
