import crypto from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { demoWorld, EVERYONE, freshCase } from "./fixtures";
import { addPad, square } from "./review-support";
import { makeJpeg, uploadForm } from "../support/images";
import type { ApiClient } from "../support/client";
import { waitForStatus } from "../support/micrographs";

// Revisions: what was signed off stays signed off (issue #15 §2). Hashes are checked with
// Node's own SHA-256 over the bytes served; canonical JSON against RFC 8785 §3.2 (no white
// space, object members sorted by key at every level).
type Revision = { number: number; status: string; signedOffBy?: string; signedOffAt?: string; sha256?: string; shapeCount: number };
type Shape = { id: string; version: number };
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

const move = (c: ApiClient, dieId: string, body: Record<string, unknown>) =>
  c.request<{ reviewStatus: string; error?: string; openRemarks?: number }>("POST", `/api/dies/${dieId}/review`, { message: "", ...body });
const sha256 = (b: Buffer | string) => crypto.createHash("sha256").update(b).digest("hex");

async function rawGet(c: ApiClient, path: string): Promise<{ status: number; bytes: Buffer; headers: Headers }> {
  const res = await fetch(`${c.baseUrl}${path}`, { headers: { cookie: c.cookie } });
  return { status: res.status, bytes: Buffer.from(await res.arrayBuffer()), headers: res.headers };
}

/** A die drawn by the demo analyst with a pad and a reference micrograph, and a second one aligned to it. */
async function markedDie() {
  const { caseId } = await freshCase(world.clients.owner, world.teamId);
  const d = await world.clients.analyst.request<{ id: string }>("POST", `/api/cases/${caseId}/dies`, { name: "die under check", widthUm: 1000, heightUm: 800 });
  const dieId = d.body.id;
  const padId = await addPad(world.clients.analyst, dieId, 100, 100);
  const jpeg = await makeJpeg(200, 160);
  const up = async (label: string) =>
    (await world.clients.analyst.upload<{ id: string }>(`/api/dies/${dieId}/micrographs`, uploadForm(jpeg, `${label}.jpg`, { label, scaleUmPerPx: "5" }))).body
      .id;
  const reference = await up("reference");
  const second = await up("second");
  // Tiled before the checks compare "before" and "after" (tiling moves the rows meanwhile).
  for (const id of [reference, second]) await waitForStatus(world.clients.analyst, id, "ready");
  return { dieId, padId, reference, second };
}

/** Every markup-writing request, each of which must answer 423 while the die is checked or signed off. */
function writes(dieId: string, padId: string, reference: string, second: string) {
  const pairs = [
    [0, 0],
    [200, 0],
    [200, 160],
  ].map(([x, y]) => ({ imagePx: [x, y], dieUm: [5 * x, 800 - 5 * y] }));
  const geojson = {
    type: "FeatureCollection",
    features: [{ type: "Feature", geometry: square(300, 300), properties: { kind: "block", name: "X", function: "test" } }],
  };
  return [
    {
      name: "POST markup",
      method: "POST",
      path: `/api/dies/${dieId}/markup`,
      body: { kind: "note", geometry: { type: "Point", coordinates: [50, 50] }, properties: { text: "n" } },
    },
    { name: "PATCH shape", method: "PATCH", path: `/api/markup/${padId}`, body: { version: 1, properties: { label: "P9" } } },
    { name: "DELETE shape", method: "DELETE", path: `/api/markup/${padId}`, body: undefined },
    { name: "import GeoJSON", method: "POST", path: `/api/dies/${dieId}/markup/import`, body: geojson },
    {
      name: "restore die frame",
      method: "POST",
      path: `/api/dies/${dieId}/frame/restore`,
      body: { originUm: [0, 0], widthUm: 1000, heightUm: 800, outline: null },
    },
    { name: "align the reference", method: "PUT", path: `/api/micrographs/${reference}/alignment`, body: { model: "similarity", pairs } },
    { name: "re-scale the reference", method: "PATCH", path: `/api/micrographs/${reference}`, body: { scaleUmPerPx: 4 } },
    { name: "change the reference", method: "PUT", path: `/api/micrographs/${second}/reference`, body: undefined },
    { name: "delete the reference", method: "DELETE", path: `/api/micrographs/${reference}`, body: undefined },
  ] as const;
}

describe("markup is fixed while with the checker and once signed off", () => {
  for (const state of ["with_checker", "signed_off"] as const) {
    it(`answers 423 { error, reviewStatus } to every markup write while ${state}, changing nothing`, async () => {
      const { dieId, padId, reference, second } = await markedDie();
      expect((await move(world.clients.analyst, dieId, { action: "send" })).status).toBe(200);
      if (state === "signed_off") expect((await move(world.clients.reviewer, dieId, { action: "sign_off" })).status).toBe(200);
      const before = (await rawGet(world.clients.owner, `/api/dies/${dieId}/markup.geojson`)).bytes;
      const micrographsBefore = (await world.clients.owner.get(`/api/dies/${dieId}/micrographs`)).body;
      for (const w of writes(dieId, padId, reference, second)) {
        const res = await world.clients.analyst.request<{ error: string; reviewStatus: string }>(w.method, w.path, w.body);
        expect(res.status, `${w.name}: ${JSON.stringify(res.body)}`).toBe(423);
        expect(res.body.reviewStatus).toBe(state);
        expect(res.body.error).toMatch(state === "with_checker" ? /with the checker/ : /signed off/);
      }
      expect((await rawGet(world.clients.owner, `/api/dies/${dieId}/markup.geojson`)).bytes.equals(before)).toBe(true);
      expect((await world.clients.owner.get(`/api/dies/${dieId}/micrographs`)).body).toEqual(micrographsBefore);
      // Remarks and a dry-run import still work: checking is not drawing.
      expect((await world.clients.reviewer.request("POST", `/api/dies/${dieId}/threads`, { shapeId: padId, body: "label?" })).status).toBe(201);
      const dry = await world.clients.analyst.request("POST", `/api/dies/${dieId}/markup/import?dryRun=true`, {
        type: "FeatureCollection",
        features: [{ type: "Feature", geometry: square(300, 300), properties: { kind: "block", name: "X", function: "test" } }],
      });
      expect(dry.status).toBe(200);
    }, 120_000);
  }

  it("lets the markup be drawn again once returned or withdrawn", async () => {
    const { dieId } = await markedDie();
    expect((await move(world.clients.analyst, dieId, { action: "send" })).status).toBe(200);
    expect((await move(world.clients.reviewer, dieId, { action: "return", message: "pad 1 label" })).status).toBe(200);
    expect((await addPad(world.clients.analyst, dieId, 300, 100)).length).toBeGreaterThan(0);
    expect((await move(world.clients.analyst, dieId, { action: "send" })).status).toBe(200);
    expect((await move(world.clients.analyst, dieId, { action: "withdraw" })).status).toBe(200);
    expect((await addPad(world.clients.analyst, dieId, 500, 100)).length).toBeGreaterThan(0);
  }, 60_000);
});

describe("revisions", () => {
  it("freezes revision 1 at sign-off byte for byte, and keeps it while revision 2 is edited", async () => {
    const { dieId, padId } = await markedDie();
    expect((await world.clients.analyst.get<Revision[]>(`/api/dies/${dieId}/revisions`)).body).toEqual([{ number: 1, status: "draft", shapeCount: 1 }]);
    expect((await move(world.clients.analyst, dieId, { action: "send" })).status).toBe(200);
    expect((await move(world.clients.reviewer, dieId, { action: "sign_off", message: "checked" })).status).toBe(200);
    const [r1] = (await world.clients.viewer.get<Revision[]>(`/api/dies/${dieId}/revisions`)).body;
    expect(r1).toMatchObject({ number: 1, status: "signed_off", signedOffBy: "Demo Reviewer", shapeCount: 1 });
    expect(r1.sha256).toMatch(/^[0-9a-f]{64}$/);
    const frozen = await rawGet(world.clients.viewer, `/api/dies/${dieId}/revisions/1/markup.geojson`);
    expect(frozen.status).toBe(200);
    expect(sha256(frozen.bytes)).toBe(r1.sha256);
    expect(frozen.headers.get("x-content-sha256")).toBe(r1.sha256);
    // RFC 8785 §3.2: no white space, members sorted by key (all keys here are ASCII, so
    // UTF-16 code-unit order is plain string order) — rebuilt independently of the server.
    const sortKeys = (v: unknown): unknown =>
      Array.isArray(v)
        ? v.map(sortKeys)
        : v && typeof v === "object"
          ? Object.fromEntries(
              Object.keys(v)
                .sort()
                .map((k) => [k, sortKeys((v as Record<string, unknown>)[k])]),
            )
          : v;
    const parsed = JSON.parse(frozen.bytes.toString("utf8"));
    expect(JSON.stringify(sortKeys(parsed))).toBe(frozen.bytes.toString("utf8"));
    expect(parsed.kerfline.revision).toEqual({ number: 1, status: "signed_off", signedOffBy: "Demo Reviewer", signedOffAt: r1.signedOffAt });
    // Only the die's drawers open the next revision, and only after sign-off.
    expect((await world.clients.reviewer.request("POST", `/api/dies/${dieId}/revisions`)).status).toBe(403);
    expect((await world.clients.outsider.request("POST", `/api/dies/${dieId}/revisions`)).status).toBe(404);
    const opened = await world.clients.analyst.request<Revision>("POST", `/api/dies/${dieId}/revisions`);
    expect(opened.status).toBe(201);
    expect(opened.body).toEqual({ number: 2, status: "draft", shapeCount: 1 });
    expect((await world.clients.analyst.request("POST", `/api/dies/${dieId}/revisions`)).status).toBe(409);
    // Revision 2 starts from revision 1's markup and is edited…
    const shape = (await world.clients.analyst.get<Shape>(`/api/markup/${padId}`)).body;
    expect((await world.clients.analyst.request("PATCH", `/api/markup/${padId}`, { version: shape.version, properties: { label: "VB1" } })).status).toBe(200);
    await addPad(world.clients.analyst, dieId, 400, 100);
    // …while revision 1 is served as it was signed.
    const again = await rawGet(world.clients.viewer, `/api/dies/${dieId}/revisions/1/markup.geojson`);
    expect(again.bytes.equals(frozen.bytes)).toBe(true);
    expect(sha256(again.bytes)).toBe(r1.sha256);
    const list = (await world.clients.viewer.get<Revision[]>(`/api/dies/${dieId}/revisions`)).body;
    expect(list).toEqual([r1, { number: 2, status: "draft", shapeCount: 2 }]);
    const live = JSON.parse((await rawGet(world.clients.viewer, `/api/dies/${dieId}/revisions/2/markup.geojson`)).bytes.toString("utf8"));
    expect(live.features).toHaveLength(2);
    expect(live.kerfline.revision).toEqual({ number: 2, status: "draft", signedOffBy: null, signedOffAt: null });
    expect((await world.clients.viewer.get(`/api/dies/${dieId}/revisions/3/markup.geojson`)).status).toBe(404);
  }, 60_000);

  it("states the revision in the GeoJSON and CSV downloads", async () => {
    const { dieId } = await markedDie();
    expect((await move(world.clients.analyst, dieId, { action: "send" })).status).toBe(200);
    expect((await move(world.clients.reviewer, dieId, { action: "sign_off" })).status).toBe(200);
    const geo = JSON.parse((await rawGet(world.clients.viewer, `/api/dies/${dieId}/markup.geojson`)).bytes.toString("utf8"));
    expect(geo.kerfline.revision).toMatchObject({ number: 1, status: "signed_off", signedOffBy: "Demo Reviewer" });
    for (const file of ["pads.csv", "markup.csv"]) {
      const res = await rawGet(world.clients.viewer, `/api/dies/${dieId}/${file}`);
      expect(decodeURIComponent(res.headers.get("content-disposition") ?? ""), file).toMatch(/rev 1 signed off \d{4}-\d\d-\d\d/);
    }
  }, 60_000);

  for (const who of EVERYONE) {
    const status = who === "anonymous" ? 401 : who === "outsider" ? 404 : 200;
    it(`lists revisions ${status} for ${who}`, async () => {
      const { dieId } = await freshCase(world.clients.owner, world.teamId);
      expect((await world.clients[who].get(`/api/dies/${dieId}/revisions`)).status).toBe(status);
      expect((await world.clients[who].get(`/api/dies/${dieId}/revisions/1/markup.geojson`)).status).toBe(status);
    });
  }
});

describe("signing off over open remarks", () => {
  it("refuses with 409 naming how many, unless overridden with a message, which the history keeps", async () => {
    const { dieId, padId } = await markedDie();
    for (const body of ["VB2 label?", "pitch?"]) {
      expect((await world.clients.reviewer.request("POST", `/api/dies/${dieId}/threads`, { shapeId: padId, body })).status).toBe(201);
    }
    expect((await move(world.clients.analyst, dieId, { action: "send" })).status).toBe(200);
    const refused = await move(world.clients.reviewer, dieId, { action: "sign_off" });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/2 remarks are still open/);
    expect(refused.body.openRemarks).toBe(2);
    const silent = await move(world.clients.reviewer, dieId, { action: "sign_off", overrideOpenRemarks: true, message: "  " });
    expect(silent.status).toBe(400);
    expect(silent.body.error).toMatch(/message/);
    expect((await world.clients.owner.get<{ reviewStatus: string }>(`/api/dies/${dieId}`)).body.reviewStatus).toBe("with_checker");
    expect((await world.clients.owner.get<Revision[]>(`/api/dies/${dieId}/revisions`)).body[0].status).toBe("with_checker");
    const ok = await move(world.clients.reviewer, dieId, { action: "sign_off", overrideOpenRemarks: true, message: "customer deadline; remarks are cosmetic" });
    expect(ok.status).toBe(200);
    const [last] = (await world.clients.viewer.get<{ action: string; message: string; overrideOpenRemarks: boolean }[]>(`/api/dies/${dieId}/review`)).body;
    expect(last).toMatchObject({ action: "sign_off", message: "customer deadline; remarks are cosmetic", overrideOpenRemarks: true });
  }, 60_000);
});
