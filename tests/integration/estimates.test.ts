import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld } from "./fixtures";

// The estimates API: published check values come through unchanged, and every bad parameter
// is refused with 400 naming it.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

type Est = Record<string, unknown> & { units: Record<string, string>; formula: string; source: string; warnings: string[] };

describe("GET /api/estimates/{kind}", () => {
  it("answers the scikit-rf CPW check value (77.93 Ω, εe 2.39) with formula, source and units", async () => {
    // scikit-rf cpw test (REFERENCES.md): w 40 µm, s 20 µm, εr 3.78, infinite substrate → 77.93 Ω, εe 2.39 [pub].
    const res = await world.clients.viewer.get<Est>("/api/estimates/cpw?widthUm=40&gapUm=20&er=3.78");
    expect(res.status).toBe(200);
    expect(res.body.z0Ohm as number).toBeCloseTo(77.93, 1);
    expect(res.body.effectivePermittivity as number).toBeCloseTo(2.39, 2);
    expect(res.body.formula).toMatch(/K\(k0/);
    expect(res.body.source).toMatch(/Wen/);
    expect(res.body.source.length).toBeGreaterThan(10);
    expect(Array.isArray(res.body.warnings)).toBe(true);
  });

  it("answers Hennessy & Patterson's 270 dies for a 1.5 cm die on a 300 mm wafer", async () => {
    // Hennessy & Patterson, 5th ed., §1.6 [pub].
    const res = await world.clients.analyst.get<Est>(
      "/api/estimates/wafer?waferDiameterMm=300&dieWidthMm=15&dieHeightMm=15&defectDensityPerCm2=0.031&model=poisson",
    );
    expect(res.status).toBe(200);
    expect(res.body.grossDies).toBe(270);
  });

  it("gives about 1 nH per mm for a 25 µm bond wire (common practice)", async () => {
    const res = await world.clients.analyst.get<Est>("/api/estimates/bond-wire?lengthUm=1000");
    expect(res.status).toBe(200);
    expect(res.body.inductanceNh as number).toBeGreaterThan(0.8);
    expect(res.body.inductanceNh as number).toBeLessThan(1.2);
  });

  const BAD: [string, string][] = [
    ["/api/estimates/bond-wire?lengthUm=-5", "lengthUm"],
    ["/api/estimates/bond-wire?lengthUm=0", "lengthUm"],
    ["/api/estimates/bond-wire?lengthUm=NaN", "lengthUm"],
    ["/api/estimates/bond-wire?lengthUm=long", "lengthUm"],
    ["/api/estimates/bond-wire", "lengthUm"],
    ["/api/estimates/strip?lengthUm=100&widthUm=5", "thicknessUm"],
    ["/api/estimates/microstrip?widthUm=10&heightUm=100", "er"],
    ["/api/estimates/cpw?widthUm=40&gapUm=-1&er=3.78", "gapUm"],
    ["/api/estimates/spiral?shape=pentagonal&turns=3&outerDiameterUm=200&widthUm=10&spacingUm=5", "shape"],
    ["/api/estimates/optics?numericalAperture=abc&cameraPixelPitchUm=5&objectiveMag=20", "numericalAperture"],
    ["/api/estimates/wafer?waferDiameterMm=300&dieWidthMm=15&dieHeightMm=15&defectDensityPerCm2=0.1&model=magic", "model"],
  ];
  for (const [path, parameter] of BAD) {
    it(`answers 400 naming ${parameter} for ${path.split("?")[1] ?? "no parameters"}`, async () => {
      const res = await world.clients.analyst.get<{ error: string; issues: { path: string }[] }>(path);
      expect(res.status).toBe(400);
      expect(res.body.error).toContain(parameter);
      expect(res.body.issues[0].path).toBe(parameter);
    });
  }

  it("answers 400 for an unknown kind and 401 when signed out", async () => {
    const res = await world.clients.analyst.get<{ error: string }>("/api/estimates/capacitor?x=1");
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/kind must be one of/);
    expect((await world.clients.anonymous.get("/api/estimates/bond-wire?lengthUm=1000")).status).toBe(401);
  });
});
