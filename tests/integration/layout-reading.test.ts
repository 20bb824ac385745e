import { beforeAll, describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { demoWorld, freshCase } from "./fixtures";
import { bondWireInductance } from "@/lib/estimates";
import { toSavedEstimate } from "@/lib/layout-reading/saved-estimates";
import type { AnyShape } from "@/lib/markup/types";

// Saving an estimate on a shape: it goes through PATCH /api/markup/{id} like any property,
// comes back in GET markup, and shows in the markup CSV; refusals change nothing.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

// Rosa 1908; Grover, Inductance Calculations, 1946: L = 2e-7·l·[ln(2l/r) − 0.75] H, computed
// here from the published formula: 1 mm of 25 µm wire → 0.86503 nH.
const ROSA_NH = 2e-7 * 1e-3 * (Math.log((2 * 1e-3) / 12.5e-6) - 0.75) * 1e9;

async function dieWithBond() {
  const { dieId } = await freshCase(world.clients.owner, world.teamId);
  // 600 × 800 µm run: 1000 µm long (3-4-5 triangle).
  const bond = {
    kind: "wire_bond",
    geometry: {
      type: "LineString",
      coordinates: [
        [100, 100],
        [700, 900],
      ],
    },
    properties: { label: "RFIN bond", diameterUm: 25 },
  };
  const res = await world.clients.analyst.request<AnyShape>("POST", `/api/dies/${dieId}/markup`, bond);
  expect(res.status).toBe(201);
  return { dieId, shape: res.body };
}

describe("estimates saved on a wire bond", () => {
  it("round-trip through PATCH, GET markup and the markup CSV", async () => {
    const { dieId, shape } = await dieWithBond();
    const inputs = { lengthUm: 1000, diameterUm: 25, count: 1, regime: "dc" as const };
    const record = toSavedEstimate("bond-wire", inputs, bondWireInductance(inputs), "2024-05-02T10:00:00.000Z");
    expect(record.inductanceNh as number).toBeCloseTo(ROSA_NH, 6);
    const patch = await world.clients.analyst.request<AnyShape>("PATCH", `/api/markup/${shape.id}`, {
      version: shape.version,
      properties: { ...shape.properties, estimates: { "bond-wire": record } },
    });
    expect(patch.status).toBe(200);

    const list = (await world.clients.viewer.get<AnyShape[]>(`/api/dies/${dieId}/markup`)).body;
    const stored = list.find((s) => s.id === shape.id)!;
    expect(stored.properties.estimates).toEqual({ "bond-wire": record });
    expect(stored.properties).toMatchObject({ label: "RFIN bond", diameterUm: 25 });

    const csv = await world.clients.reviewer.request<string>("GET", `/api/dies/${dieId}/markup.csv`);
    expect(csv.status).toBe(200);
    const rows = parse(csv.body, { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    expect(rows.find((r) => r.id === shape.id)?.estimates).toBe("L 0.865 nH");
  });

  it("refuses a reviewer's save and a nested value, and keeps the shape as it was", async () => {
    const { dieId, shape } = await dieWithBond();
    const reviewer = await world.clients.reviewer.request("PATCH", `/api/markup/${shape.id}`, {
      version: shape.version,
      properties: { ...shape.properties, estimates: { "bond-wire": { inductanceNh: 1 } } },
    });
    expect(reviewer.status).toBe(403);
    const nested = await world.clients.analyst.request<{ error: string }>("PATCH", `/api/markup/${shape.id}`, {
      version: shape.version,
      properties: { ...shape.properties, estimates: { "bond-wire": { inductanceNh: { value: 1 } } } },
    });
    expect(nested.status).toBe(400);
    expect(nested.body.error).toMatch(/estimates/);
    const list = (await world.clients.owner.get<AnyShape[]>(`/api/dies/${dieId}/markup`)).body;
    expect(list.find((s) => s.id === shape.id)).toEqual(shape);
  });
});
