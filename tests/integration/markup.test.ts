import { beforeAll, describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { randomUUID } from "node:crypto";
import { demoWorld, EVERYONE, expectedStatus, freshCase, type Who } from "./fixtures";
import type { ApiClient } from "../support/client";
import { markupTableRows, MARKUP_TABLE_HEADERS } from "@/lib/markup/markup-table";
import type { AnyShape } from "@/lib/markup/types";
import type { PadTable } from "@/lib/pads";

// The markup API over HTTP against the real server: every route for every role (nothing
// changes on a refusal), optimistic concurrency, ETags, and the two CSV downloads parsed back.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

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
const padAt = (cx: number, cy: number, label: string, net = "", state = "bonded") => ({
  kind: "pad",
  geometry: rect(cx - 40, cy - 40, 80, 80),
  properties: { label, net, state },
});
const noteAt = (x: number, y: number, text = "check this corner") => ({ kind: "note", geometry: { type: "Point", coordinates: [x, y] }, properties: { text } });

async function shapesOf(dieId: string): Promise<AnyShape[]> {
  const res = await world.clients.owner.get<AnyShape[]>(`/api/dies/${dieId}/markup`);
  expect(res.status).toBe(200);
  return res.body;
}

async function dieWithNote() {
  const { dieId } = await freshCase(world.clients.owner, world.teamId);
  const res = await world.clients.owner.request<AnyShape>("POST", `/api/dies/${dieId}/markup`, noteAt(100, 100));
  expect(res.status).toBe(201);
  return { dieId, shape: res.body };
}

describe("markup routes for every role", () => {
  for (const who of EVERYONE) {
    const read = expectedStatus(who, "read", 200);
    it(`answers list ${read}, create ${expectedStatus(who, "edit", 201)}, patch ${expectedStatus(who, "edit", 200)}, delete ${expectedStatus(who, "edit", 204)} for ${who}`, async () => {
      const { dieId, shape } = await dieWithNote();
      const client = world.clients[who];
      expect((await client.get(`/api/dies/${dieId}/markup`)).status).toBe(read);
      expect((await client.get(`/api/markup/${shape.id}`)).status).toBe(read);

      const post = await client.request<AnyShape & { error?: string }>("POST", `/api/dies/${dieId}/markup`, noteAt(200, 200, `by ${who}`));
      expect(post.status).toBe(expectedStatus(who, "edit", 201));
      if (post.status !== 201) expect(typeof post.body.error).toBe("string");
      expect((await shapesOf(dieId)).length).toBe(post.status === 201 ? 2 : 1);

      const patch = await client.request("PATCH", `/api/markup/${shape.id}`, { version: 1, properties: { text: "changed" } });
      expect(patch.status).toBe(expectedStatus(who, "edit", 200));
      const stored = (await world.clients.owner.get<AnyShape>(`/api/markup/${shape.id}`)).body;
      if (patch.status === 200) expect(stored).toMatchObject({ version: 2, properties: { text: "changed" } });
      else expect(stored).toEqual(shape);

      const del = await client.request("DELETE", `/api/markup/${shape.id}`);
      expect(del.status).toBe(expectedStatus(who, "edit", 204));
      expect((await world.clients.owner.get(`/api/markup/${shape.id}`)).status).toBe(del.status === 204 ? 404 : 200);
    });

    it(`answers ${read} for the pad table, its CSV and the markup CSV for ${who}`, async () => {
      const { dieId } = await dieWithNote();
      for (const path of ["pads", "pads.csv", "markup.csv"]) {
        expect((await world.clients[who].get(`/api/dies/${dieId}/${path}`)).status, path).toBe(read);
      }
    });
  }
});

describe("optimistic concurrency", () => {
  it("lets exactly one of two PATCHes with the same version win, and keeps the winner's change", async () => {
    const { shape } = await dieWithNote();
    let version = shape.version;
    for (let round = 0; round < 5; round++) {
      const writers: Who[] = ["owner", "analyst"];
      const results = await Promise.all(
        writers.map((who) =>
          world.clients[who].request<AnyShape & { current?: AnyShape }>("PATCH", `/api/markup/${shape.id}`, {
            version,
            properties: { text: `${who} ${round}` },
          }),
        ),
      );
      expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
      const winner = results.find((r) => r.status === 200)!;
      const loser = results.find((r) => r.status === 409)!;
      const stored = (await world.clients.owner.get<AnyShape>(`/api/markup/${shape.id}`)).body;
      expect(stored.version).toBe(version + 1);
      expect(stored).toEqual(winner.body);
      expect(loser.body.current).toEqual(stored);
      version = stored.version;
    }
  });

  it("refuses a stale version on PATCH and DELETE with the current shape, and deletes with the right one", async () => {
    const { shape } = await dieWithNote();
    const moved = await world.clients.analyst.request<AnyShape>("PATCH", `/api/markup/${shape.id}`, {
      version: 1,
      geometry: { type: "Point", coordinates: [150, 120] },
    });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ version: 2, geometry: { type: "Point", coordinates: [150, 120] }, properties: shape.properties });
    const stale = await world.clients.owner.request<{ error: string; current: AnyShape }>("PATCH", `/api/markup/${shape.id}`, {
      version: 1,
      properties: { text: "late" },
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/version 2/);
    expect(stale.body.current).toEqual(moved.body);
    expect((await world.clients.owner.request("DELETE", `/api/markup/${shape.id}?version=1`)).status).toBe(409);
    expect((await world.clients.owner.get(`/api/markup/${shape.id}`)).status).toBe(200);
    expect((await world.clients.owner.request("DELETE", `/api/markup/${shape.id}?version=2`)).status).toBe(204);
    expect((await world.clients.owner.get(`/api/markup/${shape.id}`)).status).toBe(404);
  });

  it("re-creates a deleted shape under its own id (undo of a delete) and refuses a taken id", async () => {
    const { dieId, shape } = await dieWithNote();
    expect((await world.clients.owner.request("DELETE", `/api/markup/${shape.id}`)).status).toBe(204);
    const again = await world.clients.owner.request<AnyShape>("POST", `/api/dies/${dieId}/markup`, {
      id: shape.id,
      kind: shape.kind,
      geometry: shape.geometry,
      properties: shape.properties,
    });
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ id: shape.id, version: 1, geometry: shape.geometry, properties: shape.properties });
    const taken = await world.clients.owner.request<{ error: string }>("POST", `/api/dies/${dieId}/markup`, [noteAt(1, 1), { ...noteAt(2, 2), id: shape.id }]);
    expect(taken.status).toBe(409);
    expect(taken.body.error).toMatch(/cannot be used for a new shape/);
    expect((await shapesOf(dieId)).length).toBe(1);
  });
});

describe("batches", () => {
  it("creates 10,000 shapes in one POST and answers with all of them in order", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const body = Array.from({ length: 10_000 }, (_, i) => padAt(50 + (i % 900), 50 + Math.floor(i / 900) * 60, `P${i}`));
    const res = await world.clients.analyst.request<AnyShape[]>("POST", `/api/dies/${dieId}/markup`, body);
    expect(res.status).toBe(201);
    expect(res.body.map((s) => (s.properties as { label: string }).label)).toEqual(body.map((b) => b.properties.label));
    expect((await shapesOf(dieId)).length).toBe(10_000);
  });
});

describe("ETag", () => {
  it("answers 304 for a matching If-None-Match and a new tag after a change", async () => {
    const { dieId, shape } = await dieWithNote();
    const first = await world.clients.viewer.get(`/api/dies/${dieId}/markup`);
    const tag = first.headers.get("etag")!;
    expect(tag).toMatch(/^"[^"]+"$/);
    const same = await world.clients.viewer.request("GET", `/api/dies/${dieId}/markup`, undefined, { "if-none-match": tag });
    expect(same.status).toBe(304);
    expect(same.body).toBeNull();
    expect(same.headers.get("etag")).toBe(tag);
    // Weak comparison (RFC 9110 §13.1.2): the W/ form of the same tag matches too.
    expect((await world.clients.viewer.request("GET", `/api/dies/${dieId}/markup`, undefined, { "if-none-match": `W/${tag}` })).status).toBe(304);
    // A caller outside the team learns nothing, even with the right tag.
    expect((await world.clients.outsider.request("GET", `/api/dies/${dieId}/markup`, undefined, { "if-none-match": tag })).status).toBe(404);

    await world.clients.owner.request("PATCH", `/api/markup/${shape.id}`, { version: 1, properties: { text: "new" } });
    const changed = await world.clients.viewer.request<AnyShape[]>("GET", `/api/dies/${dieId}/markup`, undefined, { "if-none-match": tag });
    expect(changed.status).toBe(200);
    expect(changed.headers.get("etag")).not.toBe(tag);
    expect(changed.body[0].properties).toEqual({ text: "new" });
  });
});

describe("pad table", () => {
  // Six pads on the invented 2400 × 1600 µm demo die, labels exercising RFC 4180 quoting.
  const PADS = [
    padAt(60, 1400, "RF_IN+, GSG", "rf_in_p"),
    padAt(60, 1000, 'VB1 "bias"', "vb1", "probed"),
    padAt(60, 600.5, "VCC", "vcc"),
    padAt(1200.25, 60, "VEE, ground", "vee", "unbonded"),
    padAt(2340, 800, "IF_OUT", "if_out"),
    padAt(1200, 1540, "VB2", "vb2", "probed"),
  ];

  async function demoSizedDie() {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    expect((await world.clients.owner.request("PATCH", `/api/dies/${dieId}`, { name: "NV-24R die A", widthUm: 2400, heightUm: 1600 })).status).toBe(200);
    const res = await world.clients.analyst.request<AnyShape[]>("POST", `/api/dies/${dieId}/markup`, PADS);
    expect(res.status).toBe(201);
    return dieId;
  }

  it("downloads as CSV that parses back to the JSON rows", async () => {
    const dieId = await demoSizedDie();
    const json = await world.clients.viewer.get<PadTable & { outlineSource: string }>(`/api/dies/${dieId}/pads`);
    expect(json.status).toBe(200);
    expect(json.body.outlineSource).toBe("die_size");
    expect(json.body.rows.map((r) => r.label)).toEqual(["RF_IN+, GSG", 'VB1 "bias"', "VCC", "VEE, ground", "IF_OUT", "VB2"]);
    expect(json.body.summary.probedNotBonded.map((p) => p.label)).toEqual(['VB1 "bias"', "VB2"]);

    const csv = await fetchText(world.clients.viewer, `/api/dies/${dieId}/pads.csv`);
    expect(csv.type).toBe("text/csv; charset=utf-8");
    expect(csv.disposition).toMatch(/^attachment; filename="NV-24R-die-A-rev-1-draft-pad-table\.csv"/);
    // csv-parse, an independent RFC 4180 parser, strict about CRLF record ends.
    const records = parse(csv.text, { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    expect(records).toHaveLength(json.body.rows.length);
    records.forEach((rec, i) => {
      const row = json.body.rows[i];
      expect(rec).toMatchObject({ number: String(row.number), id: row.id, label: row.label, net: row.net, state: row.state, side: row.side });
      const numbers = {
        x_um: row.xUm,
        y_um: row.yUm,
        x_from_centre_um: row.xFromCentreUm,
        y_from_centre_um: row.yFromCentreUm,
        width_um: row.widthUm,
        height_um: row.heightUm,
      };
      for (const [key, value] of Object.entries(numbers)) expect(Math.abs(Number(rec[key]) - value), key).toBeLessThanOrEqual(0.0005);
      expect(rec.pitch_um === "" ? null : Number(rec.pitch_um)).toEqual(row.pitchUm === null ? null : expect.closeTo(row.pitchUm, 3));
    });
  });

  it("numbers from the pad asked for as pad 1 and refuses one that is not a pad", async () => {
    const dieId = await demoSizedDie();
    const rows = (await world.clients.viewer.get<PadTable>(`/api/dies/${dieId}/pads`)).body.rows;
    const fifth = rows[4];
    const again = await world.clients.viewer.get<PadTable>(`/api/dies/${dieId}/pads?padOne=${fifth.id}`);
    expect(again.body.rows[0].id).toBe(fifth.id);
    expect((await world.clients.viewer.get(`/api/dies/${dieId}/pads?padOne=${randomUUID()}`)).status).toBe(400);
  });

  it("answers 409 without an outline or a die size, and uses a drawn outline", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    await world.clients.owner.request("PATCH", `/api/dies/${dieId}`, { widthUm: null });
    await world.clients.owner.request("POST", `/api/dies/${dieId}/markup`, padAt(60, 400, "P1"));
    const refused = await world.clients.owner.get<{ error: string }>(`/api/dies/${dieId}/pads.csv`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/no outline and no recorded size/);
    await world.clients.owner.request("POST", `/api/dies/${dieId}/markup`, { kind: "die_outline", geometry: rect(0, 0, 1000, 800) });
    const table = await world.clients.owner.get<PadTable & { outlineSource: string }>(`/api/dies/${dieId}/pads`);
    expect(table.status).toBe(200);
    expect(table.body.outlineSource).toBe("die_outline");
    expect(table.body.rows[0]).toMatchObject({ label: "P1", side: "W", xUm: 60, yUm: 400 });
  });
});

describe("markup CSV", () => {
  it("parses back to markupTableRows of the die's shapes", async () => {
    const { dieId } = await freshCase(world.clients.owner, world.teamId);
    const body = [
      padAt(100, 100, 'pad "A", left'),
      { kind: "block", geometry: rect(200, 200, 300, 150), properties: { name: "LNA, stage 1", function: "low-noise amplifier" } },
      {
        kind: "trace",
        geometry: {
          type: "LineString",
          coordinates: [
            [10, 10],
            [40, 50],
            [40, 90.125],
          ],
        },
        properties: { widthUm: 6, label: "L1" },
      },
      {
        kind: "ruler",
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 0],
            [300, 400],
          ],
        },
      },
      noteAt(500, 700, "two\nlines"),
    ];
    expect((await world.clients.analyst.request("POST", `/api/dies/${dieId}/markup`, body)).status).toBe(201);
    const shapes = await shapesOf(dieId);
    const members = (await world.clients.owner.get<{ userId: string; name: string }[]>(`/api/teams/${world.teamId}/members`)).body;
    const rows = markupTableRows(shapes, Object.fromEntries(members.map((m) => [m.userId, m.name])));
    const csv = await fetchText(world.clients.reviewer, `/api/dies/${dieId}/markup.csv`);
    expect(csv.type).toBe("text/csv; charset=utf-8");
    expect(csv.disposition).toMatch(/^attachment; filename="die-1-rev-1-draft-markup\.csv"/);
    const records = parse(csv.text, { columns: true, record_delimiter: "\r\n" }) as Record<string, string>[];
    expect(Object.keys(records[0])).toEqual(MARKUP_TABLE_HEADERS);
    expect(records).toHaveLength(rows.length);
    records.forEach((rec, i) => {
      const row = rows[i];
      expect(rec).toMatchObject({ id: row.id, kind: row.kind, label: row.label, author: "Demo Analyst", updated_at: row.updatedAt });
      const numbers = { length_um: row.lengthUm, area_um2: row.areaUm2, width_um: row.widthUm, height_um: row.heightUm, x_um: row.xUm, y_um: row.yUm };
      for (const [key, value] of Object.entries(numbers)) {
        if (value === null) expect(rec[key], key).toBe("");
        else expect(Math.abs(Number(rec[key]) - value), key).toBeLessThanOrEqual(0.0005);
      }
    });
    // 3-4-5 right triangle scaled by 100 (Pythagoras): the ruler is 500 µm long. Hand-worked.
    expect(records.find((r) => r.kind === "ruler")!.length_um).toBe("500");
  });
});

async function fetchText(client: ApiClient, path: string) {
  const res = await client.request<string>("GET", path);
  expect(res.status).toBe(200);
  return { text: res.body, type: res.headers.get("content-type"), disposition: res.headers.get("content-disposition") ?? "" };
}
