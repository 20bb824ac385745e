import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";

// Bad input always gets a 4xx with a message and writes nothing.
let world: Awaited<ReturnType<typeof demoWorld>>;
let caseId: string;
let dieId: string;
beforeAll(async () => {
  world = await demoWorld();
  ({ caseId, dieId } = await freshCase(world.clients.owner, world.teamId, "Bad input target"));
});

const countCases = async () => (await world.clients.owner.get<unknown[]>("/api/cases")).body.length;
const countDies = async () => (await world.clients.owner.get<unknown[]>(`/api/cases/${caseId}/dies`)).body.length;

type Case = { name: string; body: unknown; status: number; message: RegExp };
const CASE_BODIES: Case[] = [
  { name: "malformed JSON", body: "{ title: ", status: 400, message: /not valid JSON/ },
  { name: "a JSON array", body: "[1, 2]", status: 400, message: /Invalid body/ },
  { name: "a missing title", body: { partMarking: "x" }, status: 400, message: /title/ },
  { name: "a title of the wrong type", body: { title: 42 }, status: 400, message: /title/ },
  { name: "an empty title", body: { title: "   " }, status: 400, message: /title/ },
  { name: "a title over 200 characters", body: { title: "x".repeat(201) }, status: 400, message: /200 characters/ },
  { name: "an unknown field", body: { title: "ok", owner: "me" }, status: 400, message: /owner|nrecognized/ },
  { name: "a null body", body: "null", status: 400, message: /Invalid body/ },
  { name: "a 5 MB body", body: JSON.stringify({ title: "x", notes: "n".repeat(5 * 1024 * 1024) }), status: 413, message: /larger than/ },
];

describe("POST /api/teams/{teamId}/cases refuses bad input", () => {
  for (const c of CASE_BODIES) {
    it(`answers ${c.status} for ${c.name} and writes no row`, async () => {
      const before = await countCases();
      const res = await world.clients.owner.request<{ error: string }>("POST", `/api/teams/${world.teamId}/cases`, c.body);
      expect(res.status).toBe(c.status);
      expect(res.body.error).toMatch(c.message);
      expect(await countCases()).toBe(before);
    });
  }

  // PostgreSQL text refuses U+0000, and a lone surrogate is not Unicode text (Unicode §3.9 D76):
  // both were a 500 before; now a 400 naming the field, nothing written.
  for (const [name, raw, field] of [
    ["a NUL in the title", '{"title":"die\\u0000one","partMarking":"TP-1","package":"DIP-8","sampleId":"S-1","notes":""}', "title"],
    ["a lone surrogate in the notes", '{"title":"die one","partMarking":"TP-1","package":"DIP-8","sampleId":"S-1","notes":"x\\ud800"}', "notes"],
  ] as const) {
    it(`answers 400 for ${name} and writes no row`, async () => {
      const before = await countCases();
      const res = await world.clients.owner.request<{ error: string }>("POST", `/api/teams/${world.teamId}/cases`, raw);
      expect(res.status).toBe(400);
      expect(res.body.error).toContain(field);
      expect(await countCases()).toBe(before);
    });
  }

  it("answers 415 when the body is not sent as JSON", async () => {
    const before = await countCases();
    const res = await world.clients.owner.request<{ error: string }>("POST", `/api/teams/${world.teamId}/cases`, "title=x", { "content-type": "text/plain" });
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(/JSON/);
    expect(await countCases()).toBe(before);
  });

  it("answers 400 for a team id that is not a UUID", async () => {
    const res = await world.clients.owner.request<{ error: string }>("POST", `/api/teams/not-a-uuid/cases`, { title: "x" });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/teamId: must be a UUID/);
  });
});

describe("die bodies and ids", () => {
  const DIE_BODIES: Case[] = [
    { name: "a negative width", body: { name: "d", widthUm: -5 }, status: 400, message: /widthUm: must be positive/ },
    { name: "a width given as a string", body: { name: "d", widthUm: "2400" }, status: 400, message: /widthUm/ },
    { name: "an absurd height", body: { name: "d", heightUm: 1e12 }, status: 400, message: /heightUm/ },
    { name: "a missing name", body: { widthUm: 10 }, status: 400, message: /name/ },
    { name: "an unknown field", body: { name: "d", reviewStatus: "signed_off" }, status: 400, message: /reviewStatus|nrecognized/ },
  ];
  for (const c of DIE_BODIES) {
    it(`answers ${c.status} for ${c.name} and writes no row`, async () => {
      const before = await countDies();
      const res = await world.clients.owner.request<{ error: string }>("POST", `/api/cases/${caseId}/dies`, c.body);
      expect(res.status).toBe(c.status);
      expect(res.body.error).toMatch(c.message);
      expect(await countDies()).toBe(before);
    });
  }

  it("keeps a die unchanged when a PATCH is refused", async () => {
    const before = (await world.clients.owner.get(`/api/dies/${dieId}`)).body;
    const res = await world.clients.owner.request("PATCH", `/api/dies/${dieId}`, { name: "x".repeat(201), widthUm: 5 });
    expect(res.status).toBe(400);
    expect((await world.clients.owner.get(`/api/dies/${dieId}`)).body).toEqual(before);
  });

  for (const path of ["/api/cases/123", "/api/dies/..%2Fcases", "/api/dies/0000-0000", "/api/cases/%27%20OR%201%3D1"]) {
    it(`answers 400 or 404 with a message for the id in ${path}`, async () => {
      const res = await world.clients.owner.get<{ error?: string }>(path);
      expect([400, 404]).toContain(res.status);
      if (res.status === 400) expect(res.body.error).toMatch(/must be a UUID/);
    });
  }

  it("answers 404 for a well-formed id that does not exist", async () => {
    const res = await world.clients.owner.get<{ error: string }>("/api/dies/00000000-0000-4000-8000-000000000000");
    expect(res.status).toBe(404);
    expect(res.body.error).toMatch(/not found/);
  });
});
