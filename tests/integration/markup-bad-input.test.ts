import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, freshCase } from "./fixtures";
import type { AnyShape } from "@/lib/markup/types";

// Bad markup always gets a 4xx naming what is wrong, and writes nothing: the die's shapes and
// their ETag are the same after the refusal as before.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let note: AnyShape;
beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Bad markup target")); // die 1000 × 800 µm
  note = (
    await world.clients.owner.request<AnyShape>("POST", `/api/dies/${dieId}/markup`, {
      kind: "note",
      geometry: { type: "Point", coordinates: [10, 10] },
      properties: { text: "x" },
    })
  ).body;
});

async function state() {
  const res = await world.clients.owner.get<AnyShape[]>(`/api/dies/${dieId}/markup`);
  return { etag: res.headers.get("etag"), shapes: res.body };
}

const square = [
  [0, 0],
  [80, 0],
  [80, 80],
  [0, 80],
  [0, 0],
];
const pad = (extra: Record<string, unknown> = {}) => ({
  kind: "pad",
  geometry: { type: "Polygon", coordinates: [square] },
  properties: { label: "P", net: "", state: "bonded" },
  ...extra,
});
const ruler = (coordinates: unknown) => ({ kind: "ruler", geometry: { type: "LineString", coordinates } });
const json = (v: unknown) => JSON.stringify(v);

type Case = { name: string; body: unknown; message: RegExp };
const CORPUS: Case[] = [
  // NaN is not JSON (RFC 8259 §6: "Numeric values that cannot be represented … (such as Infinity and NaN) are not permitted").
  { name: "NaN in coordinates", body: '{"kind":"ruler","geometry":{"type":"LineString","coordinates":[[0,0],[NaN,1]]}}', message: /not valid JSON/ },
  // 1e999 is valid JSON but overflows to Infinity in JSON.parse (ECMA-262 StringToNumber rounds to ±∞).
  {
    name: "Infinity via 1e999",
    body: '{"kind":"ruler","geometry":{"type":"LineString","coordinates":[[0,0],[1e999,1]]}}',
    message: /geometry\.coordinates\.1\.0: must be finite/,
  },
  {
    name: "strings in coordinates",
    body: json(
      ruler([
        [0, 0],
        ["10", "20"],
      ]),
    ),
    message: /geometry\.coordinates\.1\.0: must be a number/,
  },
  { name: "10,001 vertices", body: json(ruler(Array.from({ length: 10_001 }, (_, i) => [i / 20, (i % 5) / 10]))), message: /at most 10000 vertices/ },
  {
    name: "a closed polygon of 2 distinct points",
    body: json(
      pad({
        geometry: {
          type: "Polygon",
          coordinates: [
            [
              [0, 0],
              [50, 0],
              [0, 0],
              [0, 0],
            ],
          ],
        },
      }),
    ),
    message: /at least 3 distinct vertices/,
  },
  {
    name: "coordinates of 1e12",
    body: json(
      ruler([
        [0, 0],
        [1e12, 0],
      ]),
    ),
    message: /geometry\.coordinates\.1\.0: must be within/,
  },
  {
    name: "coordinates beyond the die and its margin",
    body: json(
      ruler([
        [0, 0],
        [1600, 0],
      ]),
    ),
    message: /geometry\.coordinates\.1: lies outside the die and its margin \(x -500…1500 µm/,
  },
  { name: "a missing kind", body: json({ geometry: { type: "Point", coordinates: [1, 1] }, properties: { text: "x" } }), message: /kind: must be one of/ },
  { name: "an unknown kind", body: json({ kind: "via", geometry: { type: "Point", coordinates: [1, 1] } }), message: /kind: must be one of/ },
  {
    name: "a 201-character label",
    body: json(pad({ properties: { label: "x".repeat(201), net: "", state: "bonded" } })),
    message: /properties\.label: must be at most 200 characters/,
  },
  {
    name: "a LineString for a pad",
    body: json(
      pad({
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 0],
            [10, 10],
          ],
        },
      }),
    ),
    message: /geometry\.type: a pad needs a Polygon geometry/,
  },
  { name: "an unknown top-level field", body: json(pad({ layer: "metal 1" })), message: /layer/ },
  {
    name: "an unknown pad state",
    body: json(pad({ properties: { label: "P", net: "", state: "fused" } })),
    message: /properties\.state: must be one of bonded, probed, unbonded/,
  },
  { name: "an id that is not a UUID", body: json(pad({ id: "pad-1" })), message: /id: must be a UUID/ },
  { name: "an empty array", body: "[]", message: /at least one shape/ },
  {
    name: "an array whose item 3 is bad",
    body: json([
      pad(),
      pad(),
      pad(),
      ruler([
        [0, 0],
        [0, "x"],
      ]),
      pad(),
    ]),
    message: /item 3: geometry\.coordinates\.1\.1: must be a number/,
  },
];

describe("POST /api/dies/{dieId}/markup refuses bad geometry", () => {
  for (const c of CORPUS) {
    it(`answers 400 for ${c.name} and writes nothing`, async () => {
      const before = await state();
      const res = await world.clients.owner.request<{ error: string; issues?: { path: string; message: string }[] }>(
        "POST",
        `/api/dies/${dieId}/markup`,
        c.body,
      );
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(c.message);
      // Unparseable JSON has no paths to name; everything else lists its issues.
      if (!c.message.source.includes("JSON")) expect(Array.isArray(res.body.issues)).toBe(true);
      expect(await state()).toEqual(before);
    });
  }

  it("answers 415 for a body not sent as JSON", async () => {
    const res = await world.clients.owner.request("POST", `/api/dies/${dieId}/markup`, json(pad()), { "content-type": "text/plain" });
    expect(res.status).toBe(415);
  });
});

describe("PATCH and DELETE /api/markup/{id} refuse bad input", () => {
  const PATCHES: Case[] = [
    { name: "no version", body: { properties: { text: "y" } }, message: /version/ },
    { name: "nothing to change", body: { version: 1 }, message: /send geometry or properties/ },
    {
      name: "a geometry type the note cannot have",
      body: {
        version: 1,
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 0],
            [5, 5],
          ],
        },
      },
      message: /geometry\.type: a note needs a Point geometry/,
    },
    { name: "properties the note does not have", body: { version: 1, properties: { text: "y", net: "vcc" } }, message: /net|nrecognized/ },
    { name: "a point outside the die", body: { version: 1, geometry: { type: "Point", coordinates: [10, 5000] } }, message: /lies outside the die/ },
    { name: "an unknown field", body: { version: 1, kind: "pad", properties: { text: "y" } }, message: /kind|nrecognized/ },
  ];
  for (const c of PATCHES) {
    it(`answers 400 for ${c.name} and keeps the shape`, async () => {
      const res = await world.clients.owner.request<{ error: string }>("PATCH", `/api/markup/${note.id}`, c.body);
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(c.message);
      expect((await world.clients.owner.get(`/api/markup/${note.id}`)).body).toEqual(note);
    });
  }

  it("answers 400 for a version that is not a number and for ids that are not UUIDs", async () => {
    expect((await world.clients.owner.request("DELETE", `/api/markup/${note.id}?version=abc`)).status).toBe(400);
    expect((await world.clients.owner.get(`/api/markup/${note.id}`)).status).toBe(200);
    const bad = await world.clients.owner.request<{ error: string }>("PATCH", "/api/markup/not-a-uuid", { version: 1, properties: { text: "y" } });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/markupId: must be a UUID/);
    expect((await world.clients.owner.get("/api/dies/not-a-uuid/markup")).status).toBe(400);
  });

  it("answers 404 for a shape or die that does not exist", async () => {
    const missing = "00000000-0000-4000-8000-000000000000";
    expect((await world.clients.owner.request("PATCH", `/api/markup/${missing}`, { version: 1, properties: { text: "y" } })).status).toBe(404);
    expect((await world.clients.owner.request("DELETE", `/api/markup/${missing}`)).status).toBe(404);
    expect((await world.clients.owner.request("POST", `/api/dies/${missing}/markup`, pad())).status).toBe(404);
  });
});
