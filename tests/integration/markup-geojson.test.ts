import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, EVERYONE, expectedStatus, freshCase } from "./fixtures";
import type { AnyShape } from "@/lib/markup/types";
// A static import: a missing validator fails the file instead of skipping the check.
import { check as checkGeojson } from "@placemarkio/check-geojson";

// GeoJSON export and import over HTTP: a lossless round trip into a fresh die, the export
// checked by an independent GeoJSON validator, a corpus of bad files that import nothing, and
// the role matrix (any member exports; owner/analyst import; outsiders get 404).
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

type Fc = { type: string; kerfline: Record<string, unknown>; features: { id: string; type: string; geometry: unknown; properties: Record<string, unknown> }[] };

const rect = (x0: number, y0: number, w: number, h: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [x0, y0],
      [x0 + w, y0],
      [x0 + w, y0 + h],
      [x0, y0 + h],
      [x0, y0],
    ],
  ],
});
const SAMPLE = (padId: string) => [
  { id: padId, kind: "pad", geometry: rect(20, 20, 80, 80), properties: { label: "VDD", net: "VDD", state: "bonded", side: "S", isPadOne: true } },
  { kind: "pad", geometry: rect(200, 20, 80, 80), properties: { label: "OUT ± µ", net: "", state: "probed" } },
  {
    kind: "wire_bond",
    geometry: {
      type: "LineString",
      coordinates: [
        [60, 60],
        [60, -200],
      ],
    },
    properties: { diameterUm: 25, padId },
  },
  {
    kind: "block",
    geometry: {
      type: "Polygon",
      coordinates: [
        [
          [300, 300],
          [700, 300],
          [700, 600],
          [300, 600],
          [300, 300],
        ],
        [
          [400, 400],
          [450, 400],
          [450, 450],
          [400, 400],
        ],
      ],
    },
    properties: { name: "bandgap", function: "reference" },
  },
  {
    kind: "trace",
    geometry: {
      type: "LineString",
      coordinates: [
        [100, 100],
        [300, 100],
        [300, 300.125],
      ],
    },
    properties: { widthUm: 4.5, layerNote: "M2", estimates: { resistance: { ohms: 1.25, note: "sheet 0.07" } } },
  },
  {
    kind: "ruler",
    geometry: {
      type: "LineString",
      coordinates: [
        [0, 0],
        [1000, 0],
      ],
    },
    properties: { label: "width" },
  },
  {
    kind: "symmetry_axis",
    geometry: {
      type: "LineString",
      coordinates: [
        [500, 0],
        [500, 800],
      ],
    },
    properties: { name: "mirror" },
  },
  { kind: "note", geometry: { type: "Point", coordinates: [900.5, 700.25] }, properties: { text: "scratch near\nthe corner" } },
  { kind: "die_outline", geometry: rect(0, 0, 1000, 800), properties: { label: "outline" } },
];

async function dieWithSample() {
  const { dieId } = await freshCase(world.clients.owner, world.teamId);
  const padId = crypto.randomUUID();
  const res = await world.clients.owner.request("POST", `/api/dies/${dieId}/markup`, SAMPLE(padId));
  expect(res.status).toBe(201);
  return { dieId, padId };
}

async function exportOf(dieId: string): Promise<Fc> {
  const res = await world.clients.viewer.get<Fc>(`/api/dies/${dieId}/markup.geojson`);
  expect(res.status).toBe(200);
  expect(res.headers.get("content-type")).toMatch(/^application\/geo\+json/);
  return res.body;
}

async function countOf(dieId: string) {
  return (await world.clients.owner.get<AnyShape[]>(`/api/dies/${dieId}/markup`)).body.length;
}

describe("GeoJSON export and import", () => {
  it("round-trips every kind into a fresh die without loss", async () => {
    const { dieId } = await dieWithSample();
    const first = await exportOf(dieId);
    expect(first.type).toBe("FeatureCollection");
    expect(first.kerfline).toMatchObject({ units: "µm", frame: "die, origin lower-left, y up", schemaVersion: 1 });
    expect(first.features).toHaveLength(9);

    const target = await freshCase(world.clients.owner, world.teamId);
    const imported = await world.clients.analyst.request<{ total: number; counts: Record<string, number> }>(
      "POST",
      `/api/dies/${target.dieId}/markup/import`,
      first,
    );
    expect(imported.status).toBe(201);
    expect(imported.body.counts).toEqual({ pad: 2, wire_bond: 1, block: 1, trace: 1, ruler: 1, symmetry_axis: 1, note: 1, die_outline: 1 });

    const second = await exportOf(target.dieId);
    const newIdOf = new Map(first.features.map((f, i) => [f.id, second.features[i].id]));
    const strip = (fc: Fc, map?: Map<string, string>) =>
      fc.features.map((f) => ({
        type: f.type,
        geometry: f.geometry,
        properties: { ...f.properties, ...(typeof f.properties.padId === "string" && map ? { padId: map.get(f.properties.padId) } : {}) },
      }));
    expect(strip(second)).toEqual(strip(first, newIdOf));
    expect(second.features.every((f, i) => f.id !== first.features[i].id)).toBe(true);
  });

  // @placemarkio/check-geojson checks RFC 7946 structure (types, positions, closed rings); not our code.
  it("writes a collection an independent RFC 7946 validator accepts", async () => {
    const { dieId } = await dieWithSample();
    const res = await world.clients.owner.request<string>("GET", `/api/dies/${dieId}/markup.geojson`, undefined, { accept: "application/geo+json" });
    expect(() => checkGeojson(JSON.stringify(res.body))).not.toThrow();
  });

  it("previews a dry run and writes nothing", async () => {
    const { dieId } = await dieWithSample();
    const target = await freshCase(world.clients.owner, world.teamId);
    const res = await world.clients.owner.request<{ dryRun: boolean; total: number; counts: Record<string, number>; features: unknown[] }>(
      "POST",
      `/api/dies/${target.dieId}/markup/import?dryRun=1`,
      await exportOf(dieId),
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: true, total: 9, counts: { pad: 2, note: 1 } });
    expect(res.body.features).toHaveLength(9);
    expect(await countOf(target.dieId)).toBe(0);
  });
});

const feature = (over: Record<string, unknown> = {}) => ({
  type: "Feature",
  geometry: { type: "Point", coordinates: [10, 20] },
  properties: { kind: "note", text: "ok" },
  ...over,
});
const fc = (...features: unknown[]) => ({ type: "FeatureCollection", features });

describe("a bad import adds nothing", () => {
  const corpus: { name: string; body: () => string; status: number; message: RegExp }[] = [
    { name: "a file that is not JSON", body: () => "type,features\nnot,json", status: 400, message: /not valid JSON/ },
    {
      name: "a NaN literal (not JSON)",
      body: () =>
        '{"type":"FeatureCollection","features":[{"type":"Feature","geometry":{"type":"Point","coordinates":[NaN,1]},"properties":{"kind":"note","text":""}}]}',
      status: 400,
      message: /not valid JSON/,
    },
    {
      name: "a coordinate given as the text NaN",
      body: () => JSON.stringify(fc(feature(), feature({ geometry: { type: "Point", coordinates: ["NaN", 1] } }))),
      status: 400,
      message: /feature 1: geometry\.coordinates\.0: must be a number/,
    },
    {
      name: "a coordinate overflowing to Infinity",
      body: () => JSON.stringify(fc(feature())).replace("[10,20]", "[1e999,20]"),
      status: 400,
      message: /feature 0: geometry\.coordinates\.0: must be finite/,
    },
    {
      name: "the wrong type",
      body: () => JSON.stringify({ type: "GeometryCollection", geometries: [] }),
      status: 400,
      message: /type: must be "FeatureCollection"/,
    },
    {
      name: "a feature without geometry",
      body: () => JSON.stringify(fc(feature(), feature(), feature({ geometry: null }))),
      status: 400,
      message: /feature 2: geometry: is required/,
    },
    {
      name: "an unknown kind",
      body: () => JSON.stringify(fc(feature({ properties: { kind: "via" } }))),
      status: 400,
      message: /feature 0: properties\.kind: must be one of/,
    },
    {
      name: "100,000 features",
      body: () => `{"type":"FeatureCollection","features":[${new Array(100_000).fill(JSON.stringify(feature())).join(",")}]}`,
      status: 400,
      message: /holds 100000 features; one import takes at most 50000/,
    },
    {
      name: "a 21 MB file",
      body: () => JSON.stringify(fc(feature({ properties: { kind: "note", text: "x" }, padding: "y".repeat(21 * 1024 * 1024) }))),
      status: 413,
      message: /larger than/,
    },
  ];
  for (const c of corpus) {
    it(`refuses ${c.name} with ${c.status}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      const res = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${dieId}/markup/import`, c.body());
      expect(res.status).toBe(c.status);
      expect(res.body.error).toMatch(c.message);
      expect(await countOf(dieId)).toBe(0);
    });
  }
});

// RFC 7946 §12 registers application/geo+json as GeoJSON's media type; plain JSON is accepted too.
describe("import media types", () => {
  for (const type of ["application/geo+json", "application/geo+json; charset=utf-8", "application/json"]) {
    it(`accepts Content-Type: ${type}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      const res = await world.clients.owner.request("POST", `/api/dies/${dieId}/markup/import`, JSON.stringify(fc(feature())), { "content-type": type });
      expect(res.status).toBe(201);
      expect(await countOf(dieId)).toBe(1);
    });
  }
  it("refuses another media type with 415 and imports nothing", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const res = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${dieId}/markup/import`, JSON.stringify(fc(feature())), {
      "content-type": "application/jsonl",
    });
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(/application\/geo\+json/);
    expect(await countOf(dieId)).toBe(0);
  });
});

describe("GeoJSON routes for every role", () => {
  for (const who of EVERYONE) {
    const read = expectedStatus(who, "read", 200);
    const write = expectedStatus(who, "edit", 201);
    it(`answers export ${read}, import ${write}, dry run ${expectedStatus(who, "edit", 200)} for ${who}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      const client = world.clients[who];
      expect((await client.get(`/api/dies/${dieId}/markup.geojson`)).status).toBe(read);
      expect((await client.request("POST", `/api/dies/${dieId}/markup/import?dryRun=1`, fc(feature()))).status).toBe(expectedStatus(who, "edit", 200));
      expect((await client.request("POST", `/api/dies/${dieId}/markup/import`, fc(feature()))).status).toBe(write);
      expect(await countOf(dieId)).toBe(write === 201 ? 1 : 0);
    });
  }
});
