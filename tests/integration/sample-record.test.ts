import { afterAll, beforeAll, describe, expect, it } from "vitest";
import path from "node:path";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import type { PGlite } from "@electric-sql/pglite";
import { memoryTeam } from "../support/memory-team";
import { eq } from "drizzle-orm";
import * as schema from "@/db/schema";
import type { Database } from "@/db/client";
import { appendCustody, putSampleRecord } from "@/server/access/sample";
import { sampleRecordSchema, custodyEntrySchema } from "@/lib/validation/sample";
import { demoWorld, EVERYONE, expectedStatus, freshCase } from "./fixtures";
import type { CustodyEventDto, SampleRecordDto } from "@/lib/dto/sample";

// The sample record and chain of custody of a case (issue #15 §3) over HTTP against the real
// server, every role of PRODUCT.md's table; then the audit rows on the data-access layer.
let world: Awaited<ReturnType<typeof demoWorld>>;
beforeAll(async () => {
  world = await demoWorld();
});

const EMPTY: SampleRecordDto = { receivedAt: null, receivedFrom: "", condition: "", storageLocation: "", preparation: [] };
const RECORD = {
  receivedAt: "2026-11-16T10:20:00+01:00",
  receivedFrom: "Nordvik Semiconductor field returns desk",
  condition: "Sealed antistatic bag",
  storageLocation: "Dry cabinet DC-2",
  preparation: [
    {
      method: "laser_decap",
      chemicals: "",
      equipment: "Laser decapsulation cell",
      performedBy: "Demo Analyst",
      performedAt: "2026-11-18",
      notes: "Window over the die",
    },
  ],
};
const sample = (caseId: string) => `/api/cases/${caseId}/sample`;
const custody = (caseId: string) => `/api/cases/${caseId}/custody`;

describe("GET|PUT /api/cases/{caseId}/sample", () => {
  for (const who of EVERYONE) {
    it(`answers get ${expectedStatus(who, "read", 200)}, put ${expectedStatus(who, "edit", 200)} for ${who}`, async () => {
      const { caseId } = await freshCase(world.clients.owner, world.teamId);
      const get = await world.clients[who].get<SampleRecordDto>(sample(caseId));
      expect(get.status).toBe(expectedStatus(who, "read", 200));
      // A case with no saved record answers the empty record.
      if (get.status === 200) expect(get.body).toEqual(EMPTY);
      const put = await world.clients[who].request<SampleRecordDto>("PUT", sample(caseId), RECORD);
      expect(put.status).toBe(expectedStatus(who, "edit", 200));
      const after = (await world.clients.owner.get<SampleRecordDto>(sample(caseId))).body;
      if (put.status === 200) {
        // 10:20 at +01:00 is 09:20 UTC (ISO 8601 offsets, worked by hand); a date alone is midnight UTC.
        expect(after).toEqual({
          ...RECORD,
          receivedAt: "2026-11-16T09:20:00.000Z",
          preparation: [{ ...RECORD.preparation[0], performedAt: "2026-11-18T00:00:00.000Z" }],
        });
        expect(put.body).toEqual(after);
      } else {
        expect(after).toEqual(EMPTY);
        expect(typeof (put.body as unknown as { error: string }).error).toBe("string");
      }
    });
  }

  it("refuses a bad field with 400 naming it, and changes nothing", async () => {
    const { caseId } = await freshCase(world.clients.owner, world.teamId);
    const analyst = world.clients.analyst;
    expect((await analyst.request("PUT", sample(caseId), RECORD)).status).toBe(200);
    const before = (await analyst.get(sample(caseId))).body;
    const bad = [
      [{ ...RECORD, receivedAt: "16/11/2026" }, "receivedAt"],
      [{ ...RECORD, preparation: [{ ...RECORD.preparation[0], method: "boiling" }] }, "preparation.0.method"],
      [{ ...RECORD, preparation: [{ ...RECORD.preparation[0], performedAt: "tomorrow" }] }, "preparation.0.performedAt"],
      [{ ...RECORD, storageLocation: "x".repeat(201) }, "storageLocation"],
      [{ ...RECORD, updatedBy: world.userIds.owner }, "updatedBy"],
    ] as const;
    for (const [body, field] of bad) {
      const res = await analyst.request<{ error: string }>("PUT", sample(caseId), body);
      expect(res.status).toBe(400);
      expect(res.body.error).toContain(field);
    }
    expect((await analyst.get(sample(caseId))).body).toEqual(before);
  });

  it("answers the seeded record of the demo case", async () => {
    const cases = (await world.clients.viewer.get<{ id: string; title: string; package: string }[]>("/api/cases")).body;
    const demo = cases.find((c) => c.title === "NV-24R receiver teardown")!;
    expect(demo.package).not.toMatch(/lid removed/);
    const rec = (await world.clients.viewer.get<SampleRecordDto>(sample(demo.id))).body;
    expect(rec.preparation[0]).toMatchObject({ method: "acid_decap", performedBy: "Demo Analyst" });
    const log = (await world.clients.viewer.get<CustodyEventDto[]>(custody(demo.id))).body;
    expect(log.slice(0, 4).map((e) => e.action)).toEqual(["received", "stored", "checked_out", "returned"]);
  });
});

describe("the die report's sample record", () => {
  // poppler's pdftotext is an independent reader of what the report's pages draw.
  it("prints the demo case's preparation, the acid caution and the custody log", async () => {
    const cases = (await world.clients.viewer.get<{ id: string; title: string }[]>("/api/cases")).body;
    const demo = cases.find((c) => c.title === "NV-24R receiver teardown")!;
    const dies = (await world.clients.viewer.get<{ id: string }[]>(`/api/cases/${demo.id}/dies`)).body;
    const res = await fetch(`${world.clients.viewer.baseUrl}/api/dies/${dies[0].id}/report.pdf`, { headers: { cookie: world.clients.viewer.cookie } });
    expect(res.status).toBe(200);
    const dir = mkdtempSync(path.join(tmpdir(), "sample-report-"));
    try {
      writeFileSync(path.join(dir, "r.pdf"), Buffer.from(await res.arrayBuffer()));
      const text = execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", path.join(dir, "r.pdf"), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
      for (const want of [
        "Sample record",
        "Nordvik Semiconductor field returns desk",
        "Acid decapsulation and wet etching",
        "chemical hygiene plan",
        "Chain of custody",
        "Checked out",
      ])
        expect(text).toContain(want);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe("GET|POST /api/cases/{caseId}/custody", () => {
  for (const who of EVERYONE) {
    it(`answers get ${expectedStatus(who, "read", 200)}, post ${expectedStatus(who, "edit", 201)} for ${who}`, async () => {
      const { caseId } = await freshCase(world.clients.owner, world.teamId);
      const get = await world.clients[who].get<CustodyEventDto[]>(custody(caseId));
      expect(get.status).toBe(expectedStatus(who, "read", 200));
      if (get.status === 200) expect(get.body).toEqual([]);
      const post = await world.clients[who].request<CustodyEventDto>("POST", custody(caseId), { action: "received", note: `by ${who}` });
      expect(post.status).toBe(expectedStatus(who, "edit", 201));
      const log = (await world.clients.owner.get<CustodyEventDto[]>(custody(caseId))).body;
      expect(log.length).toBe(post.status === 201 ? 1 : 0);
      if (post.status === 201) expect(log[0]).toEqual(post.body);
    });
  }

  it("records who and when on the server, orders by server time, and refuses them from the body", async () => {
    const { caseId } = await freshCase(world.clients.owner, world.teamId);
    const analyst = world.clients.analyst;
    const t0 = Date.now();
    const first = await analyst.request<CustodyEventDto>("POST", custody(caseId), { action: "received", to: "Fjordlight Failure Lab", note: "courier" });
    const second = await world.clients.owner.request<CustodyEventDto>("POST", custody(caseId), { action: "stored", location: "Dry cabinet DC-2", note: "" });
    const t1 = Date.now();
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      action: "received",
      to: "Fjordlight Failure Lab",
      location: "",
      note: "courier",
      actorId: world.userIds.analyst,
      actorName: "Demo Analyst",
    });
    expect(second.body).toMatchObject({ actorId: world.userIds.owner, actorName: "Demo Owner" });
    // The server's clock, bracketed by this process's (same machine; 1 s slack for rounding).
    for (const e of [first.body, second.body]) {
      expect(Date.parse(e.at)).toBeGreaterThanOrEqual(t0 - 1000);
      expect(Date.parse(e.at)).toBeLessThanOrEqual(t1 + 1000);
    }
    for (const forged of [{ at: "2020-01-01T00:00:00Z" }, { actorId: world.userIds.viewer }, { actorName: "Someone" }]) {
      const res = await analyst.request<{ error: string }>("POST", custody(caseId), { action: "returned", note: "", ...forged });
      expect(res.status).toBe(400);
      expect(res.body.error).toContain(Object.keys(forged)[0]);
    }
    const bad = await analyst.request<{ error: string }>("POST", custody(caseId), { action: "lost", note: "" });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toContain("action");
    const log = (await analyst.get<CustodyEventDto[]>(custody(caseId))).body;
    expect(log.map((e) => e.id)).toEqual([first.body.id, second.body.id]);
    expect(Date.parse(log[0].at)).toBeLessThanOrEqual(Date.parse(log[1].at));
  });

  it("answers 405 with a JSON message to PATCH and DELETE, and the log stays as it was", async () => {
    const { caseId } = await freshCase(world.clients.owner, world.teamId);
    await world.clients.analyst.request("POST", custody(caseId), { action: "received", note: "" });
    const before = (await world.clients.owner.get(custody(caseId))).body;
    for (const method of ["PATCH", "DELETE"]) {
      const res = await world.clients.owner.request<{ error: string }>(method, custody(caseId), method === "PATCH" ? { note: "changed" } : undefined);
      expect(res.status).toBe(405);
      expect(res.body.error).toMatch(/append-only/);
    }
    expect((await world.clients.owner.get(custody(caseId))).body).toEqual(before);
  });
});

// No HTTP reader shows case-level audit rows, so this part drives the data-access layer on its
// own in-memory PGlite with the real migrations (as markup-audit.test.ts does).
describe("audit of sample and custody writes", () => {
  let client: PGlite;
  let db: Database;
  const ids = { team: "", analyst: "", viewer: "", case: "" };
  beforeAll(async () => {
    const team = await memoryTeam();
    ({ client, db } = team);
    Object.assign(ids, team.ids);
  });
  afterAll(async () => {
    await client?.close();
  });
  const audit = () => db.select().from(schema.auditEvents).where(eq(schema.auditEvents.teamId, ids.team));

  it("writes one audit row per save and per custody entry; a refused write leaves none", async () => {
    const record = sampleRecordSchema.parse(RECORD);
    await putSampleRecord(db, { userId: ids.analyst }, ids.case, record);
    const entry = await appendCustody(db, { userId: ids.analyst }, ids.case, custodyEntrySchema.parse({ action: "received", note: "" }));
    await expect(putSampleRecord(db, { userId: ids.viewer }, ids.case, { ...record, condition: "changed" })).rejects.toThrow();
    await expect(appendCustody(db, { userId: ids.viewer }, ids.case, custodyEntrySchema.parse({ action: "stored", note: "" }))).rejects.toThrow();
    const rows = await audit();
    expect(rows.map((r) => r.action).sort()).toEqual(["custody.appended", "sample.updated"]);
    const save = rows.find((r) => r.action === "sample.updated")!;
    expect(save).toMatchObject({ actorId: ids.analyst, entityType: "case_sample", entityId: ids.case, before: null });
    expect((save.after as { condition: string }).condition).toBe("Sealed antistatic bag");
    expect(rows.find((r) => r.action === "custody.appended")).toMatchObject({ entityType: "custody_event", entityId: entry.id, actorId: ids.analyst });
    expect((await db.select().from(schema.custodyEvents)).length).toBe(1);
  });
});
