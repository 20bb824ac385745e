import { beforeAll, describe, expect, it } from "vitest";
import sharp from "sharp";
import { demoWorld, freshCase } from "./fixtures";
import { uploadForm } from "../support/images";

// STYLE's handler order: params → authorize → body. An outsider gets 404 from every route
// that takes a body, whatever the body is (malformed, huge, of another type), and learns
// nothing from validation messages; a member sending the same body gets the 400 it deserves.
let world: Awaited<ReturnType<typeof demoWorld>>;
const ids: Record<string, string> = {};
const square = (x: number, y: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [x, y],
      [x + 10, y],
      [x + 10, y + 10],
      [x, y + 10],
      [x, y],
    ],
  ],
});

beforeAll(async () => {
  world = await demoWorld();
  const { caseId, dieId } = await freshCase(world.clients.owner, world.teamId, "Path scope target");
  Object.assign(ids, { caseId, dieId });
  const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 90, g: 90, b: 90 } } })
    .png()
    .toBuffer();
  const up = await world.clients.analyst.upload<{ id: string }>(
    `/api/dies/${dieId}/micrographs`,
    uploadForm(png, "m.png", { label: "scope", scaleUmPerPx: "1" }),
  );
  ids.micrographId = up.body.id;
  const shape = await world.clients.analyst.request<{ id: string }[]>("POST", `/api/dies/${dieId}/markup`, [
    { kind: "pad", geometry: square(5, 5), properties: { label: "S1", state: "bonded" } },
  ]);
  ids.markupId = (Array.isArray(shape.body) ? shape.body[0] : (shape.body as unknown as { id: string })).id;
  const thread = await world.clients.reviewer.request<{ id: string; comments: { id: string }[] }>("POST", `/api/dies/${dieId}/threads`, {
    region: square(20, 20),
    body: "scope check",
  });
  ids.threadId = thread.body.id;
  ids.commentId = thread.body.comments[0].id;
});

const ROUTES: [method: string, path: () => string, label: string][] = [
  ["POST", () => `/api/teams/${world.teamId}/cases`, "/api/teams/{id}/cases"],
  ["PATCH", () => `/api/cases/${ids.caseId}`, "/api/cases/{id}"],
  ["POST", () => `/api/cases/${ids.caseId}/dies`, "/api/cases/{id}/dies"],
  ["PATCH", () => `/api/dies/${ids.dieId}`, "/api/dies/{id}"],
  ["POST", () => `/api/dies/${ids.dieId}/markup`, "/api/dies/{id}/markup"],
  ["POST", () => `/api/dies/${ids.dieId}/threads`, "/api/dies/{id}/threads"],
  ["POST", () => `/api/dies/${ids.dieId}/exports`, "/api/dies/{id}/exports"],
  ["POST", () => `/api/dies/${ids.dieId}/review`, "/api/dies/{id}/review"],
  ["PATCH", () => `/api/markup/${ids.markupId}`, "/api/markup/{id}"],
  ["PATCH", () => `/api/micrographs/${ids.micrographId}`, "/api/micrographs/{id}"],
  ["PUT", () => `/api/micrographs/${ids.micrographId}/alignment`, "/api/micrographs/{id}/alignment"],
  ["POST", () => `/api/threads/${ids.threadId}/comments`, "/api/threads/{id}/comments"],
  ["PATCH", () => `/api/comments/${ids.commentId}`, "/api/comments/{id}"],
];

describe("membership before the body", () => {
  for (const [method, path, label] of ROUTES) {
    it(`${method} ${label}: 404 for an outsider with a malformed body, 400 for a member`, async () => {
      expect(ids.commentId).toBeTruthy();
      const outsider = await world.clients.outsider.request<{ error: string }>(method, path(), "{ not json");
      expect(outsider.status).toBe(404);
      expect(outsider.body.error).not.toMatch(/JSON|Invalid/);
      const member = await world.clients.owner.request<{ error: string }>(method, path(), "{ not json");
      expect(member.status).toBe(400);
      expect(member.body.error).toMatch(/not valid JSON/);
    });
  }

  it("answers 404 for an id that names nothing, before reading the body", async () => {
    const res = await world.clients.owner.request<{ error: string }>("PATCH", "/api/dies/00000000-0000-4000-8000-000000000000", "{ not json");
    expect(res.status).toBe(404);
    expect(res.body.error).toMatch(/die/);
  });
});
