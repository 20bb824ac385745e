import { beforeAll, describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { demoWorld, freshCase } from "./fixtures";
import { makeJpeg, uploadForm } from "../support/images";

// µm in exports carry the decimals the reference micrograph's scale resolves (one unit of the
// last digit no larger than a pixel): at 0.5 µm/px that is one decimal. Values with float noise
// like 26.999981 (what frame arithmetic leaves) must come out as 27.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Export decimals"));
  const up = await world.clients.analyst.upload(
    `/api/dies/${dieId}/micrographs`,
    uploadForm(await makeJpeg(400, 300), "bf.jpg", { label: "bright field", scaleUmPerPx: "0.5" }),
  );
  expect(up.status).toBe(202);
  // x carries 0.04 µm more than a 0.5 µm pixel resolves, y the float noise.
  const [x0, y0] = [27.039981, 26.999981];
  const ring = [
    [x0, y0],
    [x0 + 80.000004, y0],
    [x0 + 80.000004, y0 + 79.99997],
    [x0, y0 + 79.99997],
    [x0, y0],
  ];
  const res = await world.clients.analyst.request("POST", `/api/dies/${dieId}/markup`, {
    kind: "pad",
    geometry: { type: "Polygon", coordinates: [ring] },
    properties: { label: "VCC", net: "VCC", state: "unbonded" },
  });
  expect(res.status).toBe(201);
});

describe("µm in exports", () => {
  it("writes the pad table CSV at the scale's decimals, without float noise", async () => {
    const csv = await world.clients.viewer.request<string>("GET", `/api/dies/${dieId}/pads.csv`);
    expect(csv.status).toBe(200);
    const [rec] = parse(csv.body, { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    // Centre worked by hand: x 27.039981 + 40.000002 = 67.039983 → 67.0 (3 decimals gave 67.04),
    // y 26.999981 + 39.999985 = 66.999966 → 67.0; sizes 80.000004 and 79.99997 → 80.0.
    expect({ x: rec.x_um, y: rec.y_um, w: rec.width_um, h: rec.height_um }).toEqual({ x: "67", y: "67", w: "80", h: "80" });
  });

  it("writes GeoJSON coordinates at the scale's decimals", async () => {
    type Fc = { features: { geometry: { coordinates: number[][][] } }[] };
    const res = await world.clients.viewer.request<Fc | string>("GET", `/api/dies/${dieId}/markup.geojson`);
    expect(res.status).toBe(200);
    const fc = (typeof res.body === "string" ? JSON.parse(res.body) : res.body) as Fc;
    expect(fc.features[0].geometry.coordinates[0]).toEqual([
      [27, 27],
      [107, 27],
      [107, 107],
      [27, 107],
      [27, 27],
    ]);
  });
});
