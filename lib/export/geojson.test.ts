import { describe, expect, it } from "vitest";
import { markupToFeatureCollection, shapeToFeature } from "./geojson";
import { parseMarkupImport, MAX_IMPORT_FEATURES } from "./geojson-import";
import { dieBounds } from "@/lib/markup/die-bounds";
import type { AnyShape } from "@/lib/markup/types";

const pad: AnyShape = {
  id: "11111111-1111-4111-8111-111111111111",
  kind: "pad",
  geometry: {
    type: "Polygon",
    coordinates: [
      [
        [10, 10],
        [90, 10],
        [90, 90],
        [10, 90],
        [10, 10],
      ],
    ],
  },
  properties: { label: "VDD", net: "VDD", state: "bonded" },
  version: 1,
  createdBy: null,
  updatedAt: "2025-01-01T00:00:00.000Z",
};
const bond: AnyShape = {
  id: "22222222-2222-4222-8222-222222222222",
  kind: "wire_bond",
  geometry: {
    type: "LineString",
    coordinates: [
      [50, 50],
      [50, -300],
    ],
  },
  properties: { diameterUm: 25, padId: pad.id },
  version: 1,
  createdBy: null,
  updatedAt: "2025-01-01T00:00:00.000Z",
};
const bounds = dieBounds({ widthUm: 1000, heightUm: 800 });
let n = 0;
const counter = () => `00000000-0000-4000-8000-${String(++n).padStart(12, "0")}`;

describe("markupToFeatureCollection", () => {
  it("writes the members RFC 7946 requires of a FeatureCollection and its Features", () => {
    const fc = markupToFeatureCollection([pad], { name: "die A", widthUm: 1000, heightUm: 800 });
    // RFC 7946 §3.3: a FeatureCollection has "type": "FeatureCollection" and a "features" array.
    expect(fc.type).toBe("FeatureCollection");
    expect(Array.isArray(fc.features)).toBe(true);
    // RFC 7946 §3.2: a Feature has "type": "Feature", a "geometry" and a "properties" member; "id" is a string or number.
    const f = fc.features[0];
    expect(Object.keys(f).sort()).toEqual(["geometry", "id", "properties", "type"]);
    expect(f.type).toBe("Feature");
    expect(typeof f.id).toBe("string");
    // RFC 7946 §3.1.6: a linear ring has at least four positions and its first and last are equal.
    const ring = (f.geometry as unknown as { coordinates: number[][][] }).coordinates[0];
    expect(ring.length).toBeGreaterThanOrEqual(4);
    expect(ring[0]).toEqual(ring[ring.length - 1]);
    // RFC 7946 §6.1: members other than the defined ones are foreign members; ours states the frame.
    expect(fc.kerfline).toMatchObject({ units: "µm", frame: "die, origin lower-left, y up", schemaVersion: 1 });
  });

  it("puts the kind beside the shape's own properties", () => {
    expect(shapeToFeature(pad).properties).toEqual({ kind: "pad", label: "VDD", net: "VDD", state: "bonded" });
  });
});

describe("parseMarkupImport", () => {
  it("reads back what the export wrote, with new ids and the wire bond following its pad", () => {
    const r = parseMarkupImport(JSON.parse(JSON.stringify(markupToFeatureCollection([pad, bond]))), bounds, counter);
    if (!r.ok) throw new Error(r.failure.message);
    const [p, b] = r.value.shapes;
    expect(p).toMatchObject({ kind: "pad", geometry: pad.geometry, properties: pad.properties });
    expect(p.id).not.toBe(pad.id);
    expect(b.properties).toEqual({ diameterUm: 25, padId: p.id });
    expect(r.value.counts).toEqual({ pad: 1, wire_bond: 1 });
  });

  it("clears a padId that names no pad in the file and counts it", () => {
    const r = parseMarkupImport(markupToFeatureCollection([bond]), bounds, counter);
    expect(r.ok && r.value.unlinkedWireBonds).toBe(1);
    expect(r.ok && r.value.shapes[0].properties).toEqual({ diameterUm: 25, padId: null });
  });

  const feature = (over: Record<string, unknown>) => ({
    type: "Feature",
    geometry: { type: "Point", coordinates: [1, 2] },
    properties: { kind: "note", text: "x" },
    ...over,
  });
  const cases: [string, unknown, RegExp][] = [
    ["a bare array", [], /FeatureCollection object/],
    ["the wrong type", { type: "Feature", features: [] }, /type: must be "FeatureCollection"/],
    ["no features list", { type: "FeatureCollection" }, /features: must be a list/],
    ["an empty collection", { type: "FeatureCollection", features: [] }, /holds no features/],
    ["a feature without geometry", { type: "FeatureCollection", features: [feature({}), feature({ geometry: null })] }, /feature 1: geometry: is required/],
    [
      "a coordinate given as text",
      { type: "FeatureCollection", features: [feature({ geometry: { type: "Point", coordinates: ["NaN", 2] } })] },
      /feature 0: geometry\.coordinates\.0: must be a number/,
    ],
    [
      "an infinite coordinate",
      { type: "FeatureCollection", features: [feature({ geometry: { type: "Point", coordinates: [Infinity, 2] } })] },
      /feature 0: geometry\.coordinates\.0: must be finite/,
    ],
    ["an unknown kind", { type: "FeatureCollection", features: [feature({ properties: { kind: "via" } })] }, /feature 0: properties\.kind: must be one of pad/],
    ["a missing kind", { type: "FeatureCollection", features: [feature({ properties: { text: "x" } })] }, /feature 0: properties\.kind: is required/],
    [
      "geometry of the wrong type for the kind",
      { type: "FeatureCollection", features: [feature({ properties: { kind: "pad" } })] },
      /feature 0: geometry\.type: a pad needs a Polygon/,
    ],
    [
      "a shape off the die",
      { type: "FeatureCollection", features: [feature({ geometry: { type: "Point", coordinates: [90_000, 2] } })] },
      /feature 0: geometry\.coordinates: lies outside the die/,
    ],
  ];
  for (const [name, body, message] of cases) {
    it(`refuses ${name}, naming where`, () => {
      const r = parseMarkupImport(body, bounds, counter);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.failure.message).toMatch(message);
    });
  }

  it(`refuses more than ${MAX_IMPORT_FEATURES} features before reading any`, () => {
    const r = parseMarkupImport({ type: "FeatureCollection", features: new Array(MAX_IMPORT_FEATURES + 1).fill(0) }, bounds, counter);
    expect(!r.ok && r.failure.message).toMatch(/at most 50000/);
  });
});
