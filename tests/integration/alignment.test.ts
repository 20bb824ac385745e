import { beforeAll, describe, expect, inject, it } from "vitest";
import sharp from "sharp";
import { applyAffine, determinant } from "@/lib/geometry/affine";
import { demoWorld, EVERYONE, expectedStatus, freshCase } from "./fixtures";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import { MIN_MATCH_STRENGTH } from "@/lib/alignment/refinement-verdict";
import { padPairs, uploadDemoMicrograph, type UploadedDemo } from "../support/demo-micrographs";

// The demo die rendered twice (the seed's bright-field and dark-field settings at 3000 px
// wide): the renderer's placement is the ground truth (lib/demo-die/placement.ts), so control
// points are the layout's pad centres where the renderer drew them, paired with their die µm.
type Refined = {
  transform: number[][];
  rmsBeforeUm: number;
  rmsAfterUm: number;
  peak: number;
  minMatchStrength: number;
  improved: boolean | null;
  strongEnough: boolean;
  proposed: boolean;
  reason: string;
  againstId: string;
  error?: string;
};
type Alignment = { transform: number[][]; residualsUm: number[]; rmsUm: number; pairs?: unknown[]; model?: string | null; mirrored?: boolean };
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let bright: UploadedDemo;
let dark: UploadedDemo;
const FOUR = ["G1", "G6", "VCC2", "VEE1"];

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Alignment target"));
  bright = await uploadDemoMicrograph(world.clients.analyst, dieId, "bright_field");
  dark = await uploadDemoMicrograph(world.clients.analyst, dieId, "dark_field");
}, 120_000);

const put = (who: keyof typeof world.clients, id: string, body: unknown) =>
  world.clients[who].request<Alignment & { error?: string }>("PUT", `/api/micrographs/${id}/alignment`, body);
const stored = async () => (await world.clients.viewer.get<Alignment>(`/api/micrographs/${dark.id}/alignment`)).body;

describe("aligning the demo dark-field micrograph", () => {
  it("places the reference on the die frame from the layout's pads", async () => {
    const res = await put("analyst", bright.id, { model: "similarity", pairs: padPairs(bright.render) });
    expect(res.status).toBe(200);
    // Ground truth: the renderer's imageToDie of the bright-field picture.
    res.body.transform.flat().forEach((v, i) => expect(v).toBeCloseTo(bright.render.imageToDie.flat()[i], 6));
  });

  it("fits four pad pairs with RMS under 1 µm and maps every pad centre within 2 µm", async () => {
    const pairs = padPairs(dark.render, FOUR).map((p) => ({ ...p, imagePx: p.imagePx.map((v) => Math.round(v * 2) / 2) })); // clicks to ½ px
    const res = await put("analyst", dark.id, { model: "similarity", pairs });
    expect(res.status).toBe(200);
    expect(res.body.residualsUm).toHaveLength(4);
    expect(res.body.rmsUm).toBeLessThan(1);
    const t = res.body.transform as [[number, number, number], [number, number, number]];
    expect(determinant(t)).toBeLessThan(0); // image y down, die y up
    for (const { imagePx, dieUm } of padPairs(dark.render)) {
      const [u, v] = applyAffine(t, imagePx[0], imagePx[1]);
      expect(Math.hypot(u - dieUm[0], v - dieUm[1])).toBeLessThan(2);
    }
    const got = await stored();
    expect(got).toMatchObject({
      model: "similarity",
      mirrored: false,
      transform: res.body.transform,
      residualsUm: res.body.residualsUm,
      rmsUm: res.body.rmsUm,
    });
    expect(got.pairs).toEqual(pairs);
    const dto = (await world.clients.viewer.get<{ transform: number[][] }>(`/api/micrographs/${dark.id}`)).body;
    expect(dto.transform).toEqual(res.body.transform);
  });

  it("fits an affine model to all pads within 1 µm RMS", async () => {
    const res = await world.clients.analyst.request<Alignment>("POST", `/api/micrographs/${dark.id}/alignment/preview`, {
      model: "affine",
      pairs: padPairs(dark.render),
    });
    expect(res.status).toBe(200);
    expect(res.body.rmsUm).toBeLessThan(1);
  });

  it("answers a dry run without storing anything", async () => {
    const before = await stored();
    const res = await world.clients.analyst.request<Alignment>("POST", `/api/micrographs/${dark.id}/alignment/preview`, {
      model: "similarity",
      pairs: padPairs(dark.render, ["G1", "G4", "VB1"]),
    });
    expect(res.status).toBe(200);
    expect(res.body.residualsUm).toHaveLength(3);
    expect(await stored()).toEqual(before);
  });

  it("refines a rough transform's translation by phase correlation", async () => {
    const truth = dark.render.imageToDie;
    // A rough alignment 12 µm right and 9 µm down of the truth.
    const rough = [
      [truth[0][0], truth[0][1], truth[0][2] + 12],
      [truth[1][0], truth[1][1], truth[1][2] - 9],
    ];
    const res = await world.clients.analyst.request<Refined>("POST", `/api/micrographs/${dark.id}/alignment/refine`, {
      transform: rough,
      pairs: padPairs(dark.render),
      againstId: bright.id,
    });
    expect(res.status, res.body.error).toBe(200);
    expect(res.body.rmsBeforeUm).toBeCloseTo(15, 6); // √(12² + 9²), by hand
    expect(res.body.rmsAfterUm).toBeLessThan(2);
    expect(res.body).toMatchObject({ improved: true, strongEnough: true, proposed: true, minMatchStrength: MIN_MATCH_STRENGTH });
    expect(res.body.peak).toBeGreaterThanOrEqual(MIN_MATCH_STRENGTH);
    expect(res.body.reason).toMatch(/improves the fit/);
    expect((await stored()).transform).not.toEqual(res.body.transform); // proposed, not stored
    const accepted = await put("analyst", dark.id, { model: "similarity", pairs: padPairs(dark.render, FOUR), transform: res.body.transform });
    expect(accepted.status).toBe(200);
    expect((await stored()).transform).toEqual(res.body.transform);
    const flipped = res.body.transform.map((row, i) => (i === 1 ? row.map((v, j) => (j < 2 ? -v : v)) : row));
    const refused = await put("analyst", dark.id, { model: "similarity", pairs: padPairs(dark.render, FOUR), transform: flipped });
    expect(refused.status).toBe(400);
    expect(refused.body.error).toMatch(/transform fits a mirrored photo/);
  });
});

describe("a refinement that does not improve the fit", () => {
  it("is reported as not improving and not proposed, and nothing is stored", async () => {
    const truth = dark.render.imageToDie;
    // Control points entered 8 µm right and 6 µm down of the true pad centres (say, pad
    // corners clicked), and the rough transform fitted to them: RMS 0 on those points. The
    // correlation moves the transform back to the true picture, so on these points it is
    // worse by √(8² + 6²) = 10 µm (by hand): no improvement of the fit.
    const pairs = padPairs(dark.render).map((p) => ({ ...p, dieUm: [p.dieUm[0] + 8, p.dieUm[1] - 6] }));
    const rough = [
      [truth[0][0], truth[0][1], truth[0][2] + 8],
      [truth[1][0], truth[1][1], truth[1][2] - 6],
    ];
    const before = await stored();
    const res = await world.clients.analyst.request<Refined>("POST", `/api/micrographs/${dark.id}/alignment/refine`, {
      transform: rough,
      pairs,
      againstId: bright.id,
    });
    expect(res.status, res.body.error).toBe(200);
    expect(res.body.rmsBeforeUm).toBeLessThan(1e-6);
    expect(res.body.rmsAfterUm).toBeGreaterThan(8);
    expect(res.body).toMatchObject({ improved: false, proposed: false });
    expect(res.body.reason).toMatch(/does not improve the fit/);
    expect(await stored()).toEqual(before);
  });
});

describe("who may align", () => {
  it("follows the role table for PUT, dry run and GET", async () => {
    const body = { model: "similarity", pairs: padPairs(dark.render, FOUR) };
    for (const who of EVERYONE) {
      expect((await put(who, dark.id, body)).status, who).toBe(expectedStatus(who, "edit", 200));
      expect((await world.clients[who].request("POST", `/api/micrographs/${dark.id}/alignment/preview`, body)).status, who).toBe(
        expectedStatus(who, "edit", 200),
      );
      expect((await world.clients[who].request("POST", `/api/micrographs/${dark.id}/alignment/refine`, {})).status, who).toBe(expectedStatus(who, "edit", 200));
      expect((await world.clients[who].get(`/api/micrographs/${dark.id}/alignment`)).status, who).toBe(expectedStatus(who, "read", 200));
    }
  }, 60_000);
});

describe("bad alignment input", () => {
  const good = () => padPairs(dark.render, FOUR);
  const mirroredPairs = () => good().map((p) => ({ ...p, imagePx: [dark.width - p.imagePx[0], p.imagePx[1]] }));
  const CORPUS: { name: string; body: () => unknown; message: RegExp }[] = [
    { name: "one pair for a similarity", body: () => ({ model: "similarity", pairs: good().slice(0, 1) }), message: /at least 2 control points/ },
    { name: "two pairs for an affine", body: () => ({ model: "affine", pairs: good().slice(0, 2) }), message: /at least 3 control points/ },
    { name: "no pairs", body: () => ({ model: "similarity", pairs: [] }), message: /at least 2/ },
    {
      name: "a null (NaN in JSON) coordinate",
      body: () => ({ model: "similarity", pairs: [...good(), { imagePx: [null, 5], dieUm: [1, 1] }] }),
      message: /pairs/,
    },
    { name: "a string coordinate", body: () => ({ model: "similarity", pairs: [...good(), { imagePx: ["NaN", 5], dieUm: [1, 1] }] }), message: /numbers/ },
    {
      name: "duplicate image points",
      body: () => ({ model: "similarity", pairs: [...good(), { imagePx: good()[0].imagePx, dieUm: [5, 5] }] }),
      message: /1 and 5 are at the same image position/,
    },
    {
      name: "duplicate die points",
      body: () => ({ model: "affine", pairs: [...good(), { imagePx: [100, 100], dieUm: good()[1].dieUm }] }),
      message: /same die position/,
    },
    {
      name: "a point right of the image",
      body: () => ({ model: "similarity", pairs: [...good(), { imagePx: [dark.width + 10, 50], dieUm: [5, 5] }] }),
      message: /control point 5 .* outside the micrograph/i,
    },
    {
      name: "a point above the image",
      body: () => ({ model: "similarity", pairs: [{ imagePx: [10, -3], dieUm: [5, 5] }, ...good()] }),
      message: /control point 1 .* outside/i,
    },
    {
      name: "collinear points for an affine",
      body: () => ({ model: "affine", pairs: padPairs(dark.render, ["G1", "RFIN_P", "G2", "G3"]) }),
      message: /lie on one line/,
    },
    { name: "a reflection when not mirrored", body: () => ({ model: "similarity", pairs: mirroredPairs() }), message: /fit a mirrored photo/ },
    { name: "an affine reflection when not mirrored", body: () => ({ model: "affine", pairs: mirroredPairs() }), message: /fit a mirrored photo/ },
    { name: "an ordinary photo marked mirrored", body: () => ({ model: "similarity", mirrored: true, pairs: good() }), message: /not mirrored/ },
    { name: "an unknown model", body: () => ({ model: "projective", pairs: good() }), message: /model must be similarity or affine/ },
    { name: "an unknown field", body: () => ({ model: "similarity", pairs: good(), scale: 2 }), message: /Invalid body/ },
  ];

  for (const c of CORPUS) {
    it(`answers 400 for ${c.name} and changes nothing`, async () => {
      const before = await stored();
      for (const path of ["alignment", "alignment/preview"]) {
        const res = await world.clients.analyst.request<{ error: string }>(
          path === "alignment" ? "PUT" : "POST",
          `/api/micrographs/${dark.id}/${path}`,
          c.body(),
        );
        expect(res.status, path).toBe(400);
        expect(res.body.error).toMatch(c.message);
      }
      expect(await stored()).toEqual(before);
    });
  }

  it("answers 400 for a body that is not JSON, such as a bare NaN", async () => {
    const res = await world.clients.analyst.request<{ error: string }>(
      "PUT",
      `/api/micrographs/${dark.id}/alignment`,
      '{"model":"similarity","pairs":[{"imagePx":[NaN,1],"dieUm":[1,1]}]}',
    );
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/not valid JSON/);
  });

  it("accepts a mirrored photo when told it is mirrored", async () => {
    const res = await world.clients.analyst.request<Alignment>("POST", `/api/micrographs/${dark.id}/alignment/preview`, {
      model: "similarity",
      mirrored: true,
      pairs: mirroredPairs(),
    });
    expect(res.status).toBe(200);
    expect(determinant(res.body.transform as [[number, number, number], [number, number, number]])).toBeGreaterThan(0);
  });
});

describe("exporting the aligned dark field", () => {
  type ExportDto = { id: string; status: string; error: string | null; result: { width: number; height: number } | null };
  async function exported(micrographId: string): Promise<{ data: Buffer; width: number; height: number }> {
    const post = await world.clients.analyst.request<ExportDto>("POST", `/api/dies/${dieId}/exports`, {
      micrographId,
      widthPx: 700,
      kinds: [],
      region: { x: 0, y: 0, width: NV24R_LAYOUT.dieSizeUm[0], height: NV24R_LAYOUT.dieSizeUm[1] },
    });
    expect(post.status).toBe(202);
    const deadline = Date.now() + 60_000;
    let dto = post.body;
    while (dto.status !== "done" && dto.status !== "failed" && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 200));
      dto = (await world.clients.analyst.get<ExportDto>(`/api/exports/${post.body.id}`)).body;
    }
    expect(dto.status, dto.error ?? "").toBe("done");
    const cookie = (world.clients.analyst as unknown as { cookieHeader(): string }).cookieHeader();
    const png = Buffer.from(await (await fetch(`${inject("baseUrl")}/api/exports/${post.body.id}/file`, { headers: { cookie } })).arrayBuffer());
    // The image area only (the footer below it differs between the two).
    const imageRows = Math.round((700 * NV24R_LAYOUT.dieSizeUm[1]) / NV24R_LAYOUT.dieSizeUm[0]);
    const { data, info } = await sharp(png)
      .extract({ left: 0, top: 0, width: dto.result!.width, height: imageRows })
      .greyscale()
      .raw()
      .toBuffer({ resolveWithObject: true });
    return { data, width: info.width, height: info.height };
  }

  /** Gradient magnitude (central differences): edges sit where the die's structures are, whatever the lighting. */
  function edges(img: { data: Buffer; width: number; height: number }): Float64Array {
    const out = new Float64Array(img.width * img.height);
    for (let y = 1; y < img.height - 1; y++)
      for (let x = 1; x < img.width - 1; x++) {
        const at = (dx: number, dy: number) => img.data[(y + dy) * img.width + x + dx];
        out[y * img.width + x] = Math.hypot(at(1, 0) - at(-1, 0), at(0, 1) - at(0, -1));
      }
    return out;
  }

  /** Pearson correlation of two edge maps with `b` shifted by (dx, dy), over their common interior. */
  function correlation(a: Float64Array, b: Float64Array, w: number, h: number, dx: number, dy: number): number {
    let sa = 0,
      sb = 0,
      saa = 0,
      sbb = 0,
      sab = 0,
      n = 0;
    for (let y = 8; y < h - 8; y++)
      for (let x = 8; x < w - 8; x++) {
        const p = a[y * w + x];
        const q = b[(y + dy) * w + x + dx];
        sa += p;
        sb += q;
        saa += p * p;
        sbb += q * q;
        sab += p * q;
        n++;
      }
    return (sab - (sa * sb) / n) / Math.sqrt((saa - (sa * sa) / n) * (sbb - (sb * sb) / n));
  }

  it("resamples the rotated micrograph into the die frame: its edges line up with the reference's (±1 px)", async () => {
    const t = (await world.clients.viewer.get<{ transform: number[][] }>(`/api/micrographs/${dark.id}`)).body.transform;
    expect(Math.abs(t[0][1])).toBeGreaterThan(1e-3); // the stored alignment really rotates it (1.5° in the render)
    const ref = await exported(bright.id);
    const turned = await exported(dark.id);
    expect([turned.width, turned.height]).toEqual([ref.width, ref.height]);
    const a = edges(ref);
    const b = edges(turned);
    let best = { dx: 0, dy: 0, r: -1 };
    for (let dy = -4; dy <= 4; dy++)
      for (let dx = -4; dx <= 4; dx++) {
        const r = correlation(a, b, ref.width, ref.height, dx, dy);
        if (r > best.r) best = { dx, dy, r };
      }
    expect(Math.abs(best.dx)).toBeLessThanOrEqual(1);
    expect(Math.abs(best.dy)).toBeLessThanOrEqual(1);
    expect(best.r).toBeGreaterThan(0.3);
  }, 120_000);
});
