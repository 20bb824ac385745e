import { describe, it, expect } from "vitest";
import { checkInsideDie, parseNewShapes, parseShapeOfKind } from "./markup-input";
import { dieBounds } from "./die-bounds";
import { markupPatchSchema } from "@/lib/validation/markup";

const square = [
  [0, 0],
  [80, 0],
  [80, 80],
  [0, 80],
];
const pad = (extra: Record<string, unknown> = {}) => ({
  kind: "pad",
  geometry: { type: "Polygon", coordinates: [square] },
  properties: { label: "VB1", net: "vb1", state: "bonded" },
  ...extra,
});
const ruler = (coordinates: unknown) => ({ kind: "ruler", geometry: { type: "LineString", coordinates } });

function refusal(body: unknown) {
  const r = parseNewShapes(body);
  if (r.ok) throw new Error("expected a refusal");
  return r.failure;
}

describe("parseNewShapes", () => {
  it("closes an open ring, as RFC 7946 §3.1.6 requires of a linear ring", () => {
    const r = parseNewShapes(pad());
    expect(r.ok && r.value.shapes[0].geometry.coordinates).toEqual([[...square, [0, 0]]]);
    expect(r.ok && r.value.batch).toBe(false);
  });

  it("fills each kind's defaults", () => {
    const r = parseNewShapes([
      {
        kind: "wire_bond",
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 0],
            [100, 0],
          ],
        },
      },
      { kind: "pad", geometry: pad().geometry },
    ]);
    expect(r.ok && r.value.shapes.map((s) => s.properties)).toEqual([{ diameterUm: 25 }, { label: "", net: "", state: "unbonded" }]);
  });

  it("names the failing path", () => {
    expect(
      refusal(
        ruler([
          [0, 0],
          [1, "2"],
        ]),
      ).message,
    ).toBe("Invalid body: geometry.coordinates.1.1: must be a number");
    expect(
      refusal(
        ruler([
          [0, 0],
          [1, Infinity],
        ]),
      ).message,
    ).toBe("Invalid body: geometry.coordinates.1.1: must be finite");
    expect(
      refusal(
        ruler([
          [0, 0],
          [1e12, 0],
        ]),
      ).message,
    ).toMatch(/^Invalid body: geometry\.coordinates\.1\.0: must be within ±200000 µm/);
    expect(refusal(pad({ properties: { label: "x".repeat(201), net: "", state: "bonded" } })).message).toBe(
      "Invalid body: properties.label: must be at most 200 characters",
    );
  });

  it("refuses too many vertices, too few distinct points and the wrong geometry for the kind", () => {
    const many = Array.from({ length: 10_001 }, (_, i) => [i / 10, (i % 7) / 10]);
    expect(refusal(ruler(many)).message).toMatch(/geometry\.coordinates: must have at most 10000 vertices/);
    // RFC 7946 §3.1.4: a LineString has two or more (distinct, here) positions.
    expect(
      refusal(
        ruler([
          [5, 5],
          [5, 5],
        ]),
      ).message,
    ).toMatch(/at least 2 distinct points/);
    // RFC 7946 §3.1.6: a ring has at least four positions, the last equal to the first, so 3 distinct vertices.
    expect(
      refusal(
        pad({
          geometry: {
            type: "Polygon",
            coordinates: [
              [
                [0, 0],
                [10, 0],
                [0, 0],
              ],
            ],
          },
        }),
      ).message,
    ).toMatch(/geometry\.coordinates\.0: a ring needs at least 3 distinct vertices/);
    expect(
      refusal(
        pad({
          geometry: {
            type: "Polygon",
            coordinates: [
              [
                [0, 0],
                [10, 0],
                [20, 0],
                [0, 0],
              ],
            ],
          },
        }),
      ).message,
    ).toMatch(/enclose an area/);
    expect(
      refusal(
        pad({
          geometry: {
            type: "LineString",
            coordinates: [
              [0, 0],
              [1, 1],
            ],
          },
        }),
      ).message,
    ).toMatch(/^Invalid body: geometry\.type: a pad needs a Polygon geometry/);
  });

  it("refuses a missing or unknown kind and unknown fields", () => {
    const kinds = /kind: must be one of pad, wire_bond, block, symmetry_axis, trace, ruler, note, die_outline/;
    expect(refusal({ geometry: { type: "Point", coordinates: [0, 0] } }).message).toMatch(kinds);
    expect(refusal({ kind: "via", geometry: { type: "Point", coordinates: [0, 0] } }).message).toMatch(kinds);
    expect(refusal(pad({ colour: "red" })).message).toMatch(/colour/);
    expect(refusal(pad({ properties: { label: "a", net: "", state: "bonded", colour: "red" } })).issues[0].path).toBe("properties");
  });

  it("names the index of the failing item of an array and refuses repeated ids", () => {
    const items = [
      pad(),
      pad(),
      pad(),
      ruler([
        [0, 0],
        [0, Infinity],
      ]),
      pad(),
    ];
    const f = refusal(items);
    expect(f.message).toBe("Invalid body: item 3: geometry.coordinates.1.1: must be finite");
    expect(f.issues[0].path).toBe("3.geometry.coordinates.1.1");
    const id = "3f1d2c9a-5b7e-4c1d-9e8f-0a1b2c3d4e5f";
    expect(refusal([pad({ id }), pad({ id: id.toUpperCase() })]).message).toBe("Invalid body: item 1: id: repeats the id of item 0");
    expect(refusal([]).message).toMatch(/at least one shape/);
    expect(refusal(Array.from({ length: 10_001 }, () => pad())).message).toMatch(/at most 10000 shapes/);
  });

  it("bounds notes to 2000 characters and saved estimates to 50 small records", () => {
    const note = (text: string, estimates?: unknown) => ({
      kind: "note",
      geometry: { type: "Point", coordinates: [1, 1] },
      properties: { text, ...(estimates ? { estimates } : {}) },
    });
    expect(parseNewShapes(note("n".repeat(2000))).ok).toBe(true);
    expect(refusal(note("n".repeat(2001))).message).toMatch(/properties\.text: must be at most 2000 characters/);
    const fifty = Object.fromEntries(Array.from({ length: 50 }, (_, i) => [`e${i}`, { value: i, unit: "nH" }]));
    expect(parseNewShapes(note("x", fifty)).ok).toBe(true);
    expect(refusal(note("x", { ...fifty, e50: { value: 1 } })).message).toMatch(/at most 50 saved estimates/);
    expect(refusal(note("x", { l: { value: { nested: 1 } } })).issues[0].path).toBe("properties.estimates.l.value");
  });
});

describe("dieBounds and checkInsideDie", () => {
  it("widens the die by 25 % of its size, at least 500 µm, and by ±200 mm when the size is unknown", () => {
    // Demo die 2400 × 1600 µm: x margin max(600, 500) = 600, y margin max(400, 500) = 500. Hand-worked.
    expect(dieBounds({ widthUm: 2400, heightUm: 1600 })).toEqual({ minX: -600, maxX: 3000, minY: -500, maxY: 2100 });
    expect(dieBounds({ widthUm: null, heightUm: 800 })).toEqual({ minX: -200_000, maxX: 200_000, minY: -500, maxY: 1300 });
  });

  it("names the first position outside", () => {
    const bounds = dieBounds({ widthUm: 2400, heightUm: 1600 });
    const inside = {
      type: "Polygon" as const,
      coordinates: [
        [
          [-600, -500],
          [3000, -500],
          [3000, 2100],
          [-600, -500],
        ] as [number, number][],
      ],
    };
    expect(checkInsideDie([inside], bounds, false)).toBeNull();
    const out = {
      type: "LineString" as const,
      coordinates: [
        [0, 0],
        [3000.5, 0],
      ] as [number, number][],
    };
    expect(checkInsideDie([inside, out], bounds, true)?.message).toBe(
      "Invalid body: item 1: geometry.coordinates.1: lies outside the die and its margin (x -600…3000 µm, y -500…2100 µm)",
    );
    expect(checkInsideDie([{ type: "Point", coordinates: [0, -501] }], bounds, false)?.issues[0].path).toBe("geometry.coordinates");
  });
});

describe("PATCH bodies", () => {
  it("need a version and something to change", () => {
    expect(markupPatchSchema.safeParse({ version: 3, properties: { text: "x" } }).success).toBe(true);
    expect(markupPatchSchema.safeParse({ version: 3 }).success).toBe(false);
    expect(markupPatchSchema.safeParse({ geometry: { type: "Point", coordinates: [0, 0] } }).success).toBe(false);
    expect(markupPatchSchema.safeParse({ version: 1.5, properties: {} }).success).toBe(false);
  });

  it("are re-checked against the stored kind", () => {
    const r = parseShapeOfKind(
      "note",
      {
        type: "LineString",
        coordinates: [
          [0, 0],
          [1, 1],
        ],
      },
      { text: "x" },
    );
    expect(!r.ok && r.failure.message).toBe("Invalid body: geometry.type: a note needs a Point geometry");
    const t = parseShapeOfKind(
      "trace",
      {
        type: "LineString",
        coordinates: [
          [0, 0],
          [1, 1],
        ],
      },
      { label: "L1" },
    );
    expect(!t.ok && t.failure.message).toBe("Invalid body: properties.widthUm: must be a number");
  });
});
