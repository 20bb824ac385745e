import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { PGlite } from "@electric-sql/pglite";
import { memoryTeam } from "../support/memory-team";
import { eq } from "drizzle-orm";
import * as schema from "@/db/schema";
import type { Database } from "@/db/client";
import { createMarkup, deleteMarkup, updateMarkup } from "@/server/access/markup";
import { parseNewShapes } from "@/lib/markup/markup-input";

// The audit trail has no HTTP reader yet, so this file drives the data-access layer directly
// on its own in-memory PGlite with the real migrations: every change leaves one audit event in
// the same transaction, and a refused change leaves neither the change nor an event.
let client: PGlite;
let db: Database;
const ids = { team: "", analyst: "", viewer: "", die: "" };

beforeAll(async () => {
  const team = await memoryTeam();
  ({ client, db } = team);
  const [die] = await db.insert(schema.dies).values({ caseId: team.ids.case, name: "NV-24R die A", widthUm: 2400, heightUm: 1600 }).returning();
  Object.assign(ids, { team: team.ids.team, analyst: team.ids.analyst, viewer: team.ids.viewer, die: die.id });
});

afterAll(async () => {
  await client?.close();
});

const events = () => db.select().from(schema.auditEvents).where(eq(schema.auditEvents.dieId, ids.die));
const shapes = () => db.select().from(schema.markup).where(eq(schema.markup.dieId, ids.die));
function input(body: unknown) {
  const r = parseNewShapes(body);
  if (!r.ok) throw new Error(r.failure.message);
  return r.value;
}
const note = (x: number) => ({ kind: "note", geometry: { type: "Point", coordinates: [x, 10] }, properties: { text: `n${x}` } });

describe("markup audit trail", () => {
  it("records one event per created, changed and deleted shape, with before and after", async () => {
    const analyst = { userId: ids.analyst };
    const batch = input([note(1), note(2), note(3)]);
    const created = await createMarkup(db, analyst, ids.die, batch.shapes, batch.batch);
    const changed = await updateMarkup(db, analyst, created[0].id, { version: 1, properties: { text: "moved" } });
    await deleteMarkup(db, analyst, created[1].id, 1);
    const log = await events();
    expect(log.map((e) => e.action).sort()).toEqual(["markup.created", "markup.created", "markup.created", "markup.deleted", "markup.updated"]);
    expect(log.every((e) => e.teamId === ids.team && e.actorId === ids.analyst && e.entityType === "markup")).toBe(true);
    const update = log.find((e) => e.action === "markup.updated")!;
    expect(update.entityId).toBe(created[0].id);
    expect(update.before).toMatchObject({ version: 1, properties: { text: "n1" } });
    expect(update.after).toMatchObject({ version: 2, properties: { text: "moved" } });
    expect(changed.version).toBe(2);
    expect(log.find((e) => e.action === "markup.deleted")!.before).toMatchObject({ id: created[1].id });
  });

  it("writes neither shape nor event when a change is refused", async () => {
    const [before, beforeShapes] = [await events(), await shapes()];
    const viewer = { userId: ids.viewer };
    await expect(createMarkup(db, viewer, ids.die, input(note(9)).shapes, false)).rejects.toMatchObject({ status: 403 });
    const outside = input([note(4), { kind: "note", geometry: { type: "Point", coordinates: [9000, 10] }, properties: { text: "far" } }]);
    await expect(createMarkup(db, { userId: ids.analyst }, ids.die, outside.shapes, true)).rejects.toMatchObject({
      status: 400,
      message: /item 1: geometry\.coordinates/,
    });
    const target = beforeShapes[0];
    await expect(updateMarkup(db, { userId: ids.analyst }, target.id, { version: target.version + 5, properties: { text: "stale" } })).rejects.toMatchObject({
      status: 409,
    });
    expect(await events()).toEqual(before);
    expect(await shapes()).toEqual(beforeShapes);
  });
});
