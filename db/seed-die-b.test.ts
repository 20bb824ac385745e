import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { asc, eq } from "drizzle-orm";
import { openDatabase, type OpenedDatabase } from "./client";
import { auditEvents, comments, dies, markup, threads, users } from "./schema";
import { DEMO, seedDemo } from "./seed";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import { padTableFromMarkup } from "@/lib/markup/pad-table-from-markup";
import type { AnyShape } from "@/lib/markup/types";

// The seed on a fresh embedded database, checked against the invented NV-24R layout
// (lib/demo-die/layout.ts), the ground truth die B's markup is taken from.
let opened: OpenedDatabase;
let dir: string;

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-seed-b-"));
  opened = await openDatabase({ pgliteDir: dir });
  expect(await seedDemo(opened.db)).toBe(true);
});

afterAll(async () => {
  await opened?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("demo seed, die B", () => {
  it("adds die B after die A in the demo case, left in draft", async () => {
    const rows = await opened.db.select().from(dies).orderBy(asc(dies.createdAt));
    expect(rows.map((d) => d.name)).toEqual([DEMO.die.name, DEMO.dieB.name]);
    expect(rows[0].caseId).toBe(rows[1].caseId);
    expect(rows[1].reviewStatus).toBe("draft");
    const [analyst] = await opened.db.select().from(users).where(eq(users.email, "analyst@fjordlight.test"));
    expect(rows[1].analystId).toBe(analyst.id);
  });

  it("stores die B's complete markup, drawn by the analyst, whose pad table lists every layout pad", async () => {
    const [b] = await opened.db.select().from(dies).where(eq(dies.name, DEMO.dieB.name));
    const rows = await opened.db.select().from(markup).where(eq(markup.dieId, b.id)).orderBy(asc(markup.seq));
    expect(rows.every((r) => r.createdBy === b.analystId)).toBe(true);
    const shapes = rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() }) as unknown as AnyShape);
    const result = padTableFromMarkup(shapes, b);
    if (!result.ok) throw new Error(result.message);
    expect(result.table.rows.map((r) => r.label).sort()).toEqual(NV24R_LAYOUT.pads.map((p) => p.label).sort());
    const created = await opened.db.select().from(auditEvents).where(eq(auditEvents.dieId, b.id));
    expect(created.filter((e) => e.action === "markup.created")).toHaveLength(rows.length);
    // Die A stays open for drawing.
    const [a] = await opened.db.select().from(dies).where(eq(dies.name, DEMO.die.name));
    expect(await opened.db.select().from(markup).where(eq(markup.dieId, a.id))).toEqual([]);
  });

  it("holds one resolved remark on a pad: the reviewer's question, then the analyst's answer", async () => {
    const [b] = await opened.db.select().from(dies).where(eq(dies.name, DEMO.dieB.name));
    const people = new Map((await opened.db.select().from(users)).map((u) => [u.id, u.name]));
    const list = await opened.db.select().from(threads).where(eq(threads.dieId, b.id));
    expect(list).toHaveLength(1);
    const [t] = list;
    expect([t.status, people.get(t.createdBy!), people.get(t.resolvedBy!)]).toEqual(["resolved", "Demo Reviewer", "Demo Analyst"]);
    const [pad] = await opened.db.select().from(markup).where(eq(markup.id, t.shapeId!));
    expect(pad.kind).toBe("pad");
    expect(t.anchor).toEqual(pad.geometry);
    const said = await opened.db.select().from(comments).where(eq(comments.threadId, t.id)).orderBy(asc(comments.createdAt));
    expect(said.map((c) => people.get(c.authorId!))).toEqual(["Demo Reviewer", "Demo Analyst"]);
  });
});
