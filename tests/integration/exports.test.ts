import { beforeAll, describe, expect, inject, it } from "vitest";
import fs from "node:fs/promises";
import path from "node:path";
import sharp from "sharp";
import { demoWorld, EVERYONE, freshCase, type Who } from "./fixtures";
import { uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";

// Annotated PNG exports over HTTP: a job queued by any member, rendered by the server's worker,
// checked pixel by pixel against the die → output map written out by hand and against an
// independent sharp extract of the uploaded image; outsiders get 404 for the export and its file.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;
let micrographId: string;
let source: Buffer;

const W = 1000;
const H = 800;

async function rampPng(): Promise<Buffer> {
  const raw = Buffer.alloc(W * H * 3);
  for (let y = 0; y < H; y++)
    for (let x = 0; x < W; x++) {
      const i = (y * W + x) * 3;
      raw[i] = Math.round((x / W) * 120);
      raw[i + 1] = Math.round((y / H) * 120);
      raw[i + 2] = 60;
    }
  return sharp(raw, { raw: { width: W, height: H, channels: 3 } })
    .png()
    .toBuffer();
}

type ExportDto = {
  id: string;
  status: string;
  progress: number;
  error: string | null;
  warnings: string[];
  fileName: string | null;
  result: { width: number; height: number; umPerPx: number; scaleBar: { label: string; lengthUm: number; x: number; y: number } } | null;
};

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId));
  source = await rampPng();
  // 1 µm/px: the reference's transform is then [[1, 0, 0], [0, -1, 800]] (image top-left at die y = 800).
  const up = await world.clients.analyst.upload<{ id: string }>(
    `/api/dies/${dieId}/micrographs`,
    uploadForm(source, "ramp.png", { label: "ramp bright field", scaleUmPerPx: "1" }),
  );
  expect(up.status).toBe(202);
  micrographId = up.body.id;
  await waitForStatus(world.clients.analyst, micrographId, "ready");
  const pad = {
    kind: "pad",
    geometry: {
      type: "Polygon",
      coordinates: [
        [
          [300, 200],
          [400, 200],
          [400, 300],
          [300, 300],
          [300, 200],
        ],
      ],
    },
    properties: { label: "", state: "unbonded" },
  };
  expect((await world.clients.analyst.request("POST", `/api/dies/${dieId}/markup`, pad)).status).toBe(201);
});

async function finished(who: Who, id: string): Promise<ExportDto> {
  const deadline = Date.now() + 60_000;
  for (;;) {
    const res = await world.clients[who].get<ExportDto>(`/api/exports/${id}`);
    expect(res.status).toBe(200);
    if (res.body.status === "done" || res.body.status === "failed") return res.body;
    if (Date.now() > deadline) throw new Error(`export still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function download(who: Who, id: string) {
  const cookie = (world.clients[who] as unknown as { cookieHeader(): string }).cookieHeader();
  const res = await fetch(`${inject("baseUrl")}/api/exports/${id}/file`, { headers: { cookie } });
  return { res, body: Buffer.from(await res.arrayBuffer()) };
}

async function exportAs(who: Who, body: Record<string, unknown>) {
  return world.clients[who].request<ExportDto & { error?: string }>("POST", `/api/dies/${dieId}/exports`, { micrographId, ...body });
}

describe("annotated PNG export", () => {
  it("draws the pad where the die → output map puts it and names the file case-die-micrograph-date", async () => {
    // Region x 200–600 µm, y 100–400 µm at 2 µm/px → 200 × 150 px; output x = (x − 200) / 2, y = (400 − y) / 2.
    const post = await exportAs("viewer", { region: { x: 200, y: 100, width: 400, height: 300 }, umPerPx: 2, labels: false });
    expect(post.status).toBe(202);
    const done = await finished("viewer", post.body.id);
    expect(done.status).toBe("done");
    expect(done.result).toMatchObject({ width: 200, umPerPx: 2 });
    const { res, body } = await download("viewer", post.body.id);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("image/png");
    expect(res.headers.get("content-disposition")).toMatch(/filename="Test-case-[a-z0-9]+-die-1-ramp-bright-field-\d{4}-\d{2}-\d{2}\.png"/);
    const { data, info } = await sharp(body).raw().toBuffer({ resolveWithObject: true });
    const at = (x: number, y: number) => data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3);
    // The ramp's red never exceeds its blue by 60; the pad's amber stroke does.
    const row = (400 - 250) / 2;
    const hits = Array.from({ length: 200 }, (_, x) => x).filter((x) => at(x, row)[0] - at(x, row)[2] > 80);
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    expect(Math.abs(mean(hits.filter((x) => x < 75)) - (300 - 200) / 2)).toBeLessThanOrEqual(1);
    expect(Math.abs(mean(hits.filter((x) => x > 75)) - (400 - 200) / 2)).toBeLessThanOrEqual(1);
    // Scale bar: pure white run in the footer, length = label / scale.
    const bar = done.result!.scaleBar;
    const white = Array.from({ length: info.width }, (_, x) => x).filter((x) => [...at(x, bar.y + 1)].every((v) => v > 250));
    const [value, unit] = bar.label.split(" ");
    expect(unit).toBe("µm");
    expect(Math.abs(white.length - Number(value) / 2)).toBeLessThanOrEqual(1);
    // libvips reads the tEXt chunks back as comments.
    const comments = Object.fromEntries(((await sharp(body).metadata()).comments ?? []).map((c) => [c.keyword, c.text]));
    expect(comments).toMatchObject({ Software: "Kerfline" });
    expect(comments.Description).toContain("2 um/px");
  });

  it("shows the source pixels of the region, as an independent extract and resize does", async () => {
    const post = await exportAs("owner", { region: { x: 200, y: 100, width: 400, height: 300 }, widthPx: 200, kinds: [] });
    const done = await finished("owner", post.body.id);
    expect(done.status).toBe("done");
    const { body } = await download("owner", post.body.id);
    const ours = await sharp(body).extract({ left: 0, top: 0, width: 200, height: 150 }).raw().toBuffer();
    // Die y 100–400 µm is image rows 800 − 400 = 400 to 700.
    const ref = await sharp(source).extract({ left: 200, top: 400, width: 400, height: 300 }).resize(200, 150).raw().toBuffer();
    let diff = 0;
    for (let i = 0; i < ref.length; i++) diff += Math.abs(ref[i] - ours[i]);
    expect(diff / ref.length).toBeLessThan(1.5);
  });

  it("warns when the output enlarges the micrograph", async () => {
    const post = await exportAs("owner", { region: { x: 0, y: 0, width: 100, height: 100 }, widthPx: 400 });
    expect(post.status).toBe(202);
    expect(post.body.warnings.join(" ")).toMatch(/enlarged 4\.00×/);
  });

  it("refuses bad requests with 400 and writes no export", async () => {
    const before = (await world.clients.owner.get<unknown[]>(`/api/dies/${dieId}/exports`)).body.length;
    for (const [body, message] of [
      [{ widthPx: 20_000 }, /widthPx: must be at most 16384/],
      [{ widthPx: 100, umPerPx: 2 }, /not both/],
      [{ umPerPx: 0.01 }, /at most 16384 px/],
      [{ kinds: ["via"] }, /must be one of/],
      [{ region: { x: 0, y: 0, width: -5, height: 10 } }, /width: must be positive/],
    ] as const) {
      const res = await exportAs("owner", body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error).toMatch(message);
    }
    const other = await freshCase(world.clients.owner, world.teamId);
    expect((await world.clients.owner.request("POST", `/api/dies/${other.dieId}/exports`, { micrographId })).status).toBe(404);
    expect((await world.clients.owner.get<unknown[]>(`/api/dies/${dieId}/exports`)).body.length).toBe(before);
  });
});

describe("export preview", () => {
  type Preview = {
    width: number;
    height: number;
    umPerPx: number;
    warnings: string[];
    png: string;
    previewWidth: number;
    previewHeight: number;
    error?: string;
  };
  const preview = (who: Who, body: Record<string, unknown>, die = dieId) =>
    world.clients[who].request<Preview>("POST", `/api/dies/${die}/exports/preview`, { micrographId, ...body });

  it("states the final size and scale and returns a small PNG of the same region, storing nothing", async () => {
    const before = (await world.clients.viewer.get<unknown[]>(`/api/dies/${dieId}/exports`)).body.length;
    const res = await preview("viewer", { region: { x: 200, y: 100, width: 400, height: 300 }, widthPx: 2000 });
    expect(res.status, res.body.error).toBe(200);
    // 400 µm over 2000 px = 0.2 µm/px; 300 µm tall → 1500 px (by hand).
    expect([res.body.width, res.body.height, res.body.umPerPx]).toEqual([2000, 1500, 0.2]);
    expect(res.body.warnings.join(" ")).toMatch(/enlarged 5\.00×/);
    const png = Buffer.from(res.body.png, "base64");
    const meta = await sharp(png).metadata();
    expect(meta.format).toBe("png");
    expect(meta.width).toBe(640);
    expect([res.body.previewWidth, res.body.previewHeight]).toEqual([meta.width, meta.height]);
    // The image area matches the same region of the upload, resized independently (480 rows of 640 px).
    const ours = await sharp(png).extract({ left: 0, top: 0, width: 640, height: 480 }).raw().toBuffer();
    const ref = await sharp(source).extract({ left: 200, top: 400, width: 400, height: 300 }).resize(640, 480).raw().toBuffer();
    let diff = 0;
    for (let i = 0; i < ref.length; i++) diff += Math.abs(ref[i] - ours[i]);
    expect(diff / ref.length).toBeLessThan(3);
    expect((await world.clients.viewer.get<unknown[]>(`/api/dies/${dieId}/exports`)).body.length).toBe(before);
  });

  it("answers the same 400s as creating the export, and 404 outside the team", async () => {
    for (const [body, message] of [
      [{ widthPx: 20_000 }, /widthPx: must be at most 16384/],
      [{ umPerPx: 0.01 }, /at most 16384 px/],
      [{ kinds: ["via"] }, /must be one of/],
    ] as const) {
      const res = await preview("analyst", body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error).toMatch(message);
    }
    expect((await preview("outsider", { widthPx: 100 })).status).toBe(404);
    expect((await preview("anonymous", { widthPx: 100 })).status).toBe(401);
  });
});

describe("an export whose micrograph can no longer be read", () => {
  it("ends failed with a reason, serves no file and leaves nothing in the exports folder", async () => {
    const other = await freshCase(world.clients.owner, world.teamId, "Broken source");
    const up = await world.clients.analyst.upload<{ id: string }>(
      `/api/dies/${other.dieId}/micrographs`,
      uploadForm(source, "ramp.png", { label: "to be damaged", scaleUmPerPx: "1" }),
    );
    expect(up.status).toBe(202);
    await waitForStatus(world.clients.analyst, up.body.id, "ready");
    // The stored original is damaged on disk after tiling (a failing disk, a careless hand).
    const original = path.join(inject("dataDir"), "originals", other.dieId, `${up.body.id}.png`);
    await fs.writeFile(original, source.subarray(0, 200));
    const post = await world.clients.analyst.request<ExportDto>("POST", `/api/dies/${other.dieId}/exports`, { micrographId: up.body.id, widthPx: 300 });
    expect(post.status).toBe(202);
    const done = await finished("analyst", post.body.id);
    expect(done.status).toBe("failed");
    expect(done.error).toMatch(/^The export failed: /);
    expect(done.fileName).toBeNull();
    const { res } = await download("analyst", post.body.id);
    expect(res.status).toBe(409); // not done: there is no file to serve
    const left = await fs.readdir(path.join(inject("dataDir"), "exports", other.dieId)).catch(() => [] as string[]);
    expect(left).toEqual([]);
    // The server keeps working: a good export right after still renders.
    const again = await exportAs("analyst", { widthPx: 120 });
    expect((await finished("analyst", again.body.id)).status).toBe("done");
  });
});

describe("export rights for every role", () => {
  let exportId: string;
  beforeAll(async () => {
    const post = await exportAs("analyst", { widthPx: 100 });
    exportId = post.body.id;
    await finished("analyst", exportId);
  });
  for (const who of EVERYONE) {
    const member = who !== "outsider" && who !== "anonymous";
    const denied = who === "anonymous" ? 401 : 404;
    it(`answers create ${member ? 202 : denied}, status and file ${member ? 200 : denied} for ${who}`, async () => {
      expect((await exportAs(who, { widthPx: 64 })).status).toBe(member ? 202 : denied);
      expect((await world.clients[who].get(`/api/exports/${exportId}`)).status).toBe(member ? 200 : denied);
      expect((await download(who, exportId)).res.status).toBe(member ? 200 : denied);
      expect((await world.clients[who].get(`/api/dies/${dieId}/exports`)).status).toBe(member ? 200 : denied);
    });
  }
});
