import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { auditEvents, markup, users, type MarkupRow } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie, loadDieOf } from "./dies";
import type { DieDto } from "@/lib/dto/dies";
import { recordAudit, snapshot } from "./audit";
import { reframeToOutline } from "./die-frame";
import { assertMarkupOpen } from "./markup-lock";
import type { PolygonGeometry } from "@/lib/geometry/types";
import { BadRequestError, ConflictError, NotFoundError } from "@/lib/errors";
import { dieBounds } from "@/lib/markup/die-bounds";
import { checkInsideDie, parseShapeOfKind, type InputFailure } from "@/lib/markup/markup-input";
import type { NewShapeInput, MarkupPatch } from "@/lib/validation/markup";
import type { AnyShape } from "@/lib/markup/types";
import type { TeamAction } from "@/lib/auth/permissions";

/** Rows per INSERT: well below PostgreSQL's 65,535 bind parameters at 8 columns a row. */
const INSERT_CHUNK = 500;

/** A stored markup row as the API answers it. */
export function toShape(row: MarkupRow): AnyShape {
  return {
    id: row.id,
    kind: row.kind,
    geometry: row.geometry,
    properties: row.properties,
    version: row.version,
    createdBy: row.createdBy,
    updatedAt: row.updatedAt.toISOString(),
  } as AnyShape;
}

const refuse = (f: InputFailure) => new BadRequestError(f.message, f.issues);

/** Loads a shape and checks the caller may do `action` on its die (404 outside the team). */
async function loadShape(db: Db, actor: Actor, id: string, action: TeamAction) {
  const [row] = await db.select().from(markup).where(eq(markup.id, id));
  const { die } = await loadDieOf(db, actor, row, action, "That shape");
  return { row, die };
}

/** One shape as the caller may see it. */
export async function getShape(db: Db, actor: Actor, id: string): Promise<AnyShape> {
  return toShape((await loadShape(db, actor, id, "read")).row);
}

/** All shapes of a die in the order they were created, with the die (for its size and name). */
export async function listMarkup(db: Db, actor: Actor, dieId: string, action: TeamAction = "read"): Promise<{ die: DieDto; shapes: AnyShape[] }> {
  const { dto } = await loadDie(db, actor, dieId, action);
  const rows = await db.select().from(markup).where(eq(markup.dieId, dieId)).orderBy(asc(markup.seq));
  return { die: dto, shapes: rows.map(toShape) };
}

/** Display names of the users who drew the given shapes, by user id. */
export async function markupAuthors(db: Db, shapes: readonly AnyShape[]): Promise<Record<string, string>> {
  const ids = [...new Set(shapes.flatMap((s) => (s.createdBy ? [s.createdBy] : [])))];
  if (ids.length === 0) return {};
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids));
  return Object.fromEntries(rows.map((r) => [r.id, r.name]));
}

function isUniqueViolation(e: unknown): boolean {
  for (let c: unknown = e; c && typeof c === "object"; c = (c as { cause?: unknown }).cause) {
    if ((c as { code?: unknown }).code === "23505") return true;
  }
  return false;
}

/**
 * One "markup.created" audit event per shape, as recordAudit writes them, but in multi-row
 * inserts: 10,000 single inserts would hold the transaction for seconds.
 */
async function auditCreations(db: Db, actor: Actor, teamId: string, rows: readonly MarkupRow[]): Promise<void> {
  if (rows.length === 1) {
    await recordAudit(db, actor, { teamId, action: "markup.created", entityType: "markup", entityId: rows[0].id, dieId: rows[0].dieId, after: rows[0] });
    return;
  }
  for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
    const values = rows.slice(i, i + INSERT_CHUNK).map((row) => ({
      teamId,
      actorId: actor.userId,
      action: "markup.created",
      entityType: "markup",
      entityId: row.id,
      dieId: row.dieId,
      before: null,
      after: snapshot(row),
    }));
    await db.insert(auditEvents).values(values);
  }
}

// Ids are unique across all teams. A taken id gets this same answer whoever holds it — this
// team or another — so the answer never says that a shape exists somewhere else.
const takenMessage = (id: string) => `The id ${id} cannot be used for a new shape: send a fresh random UUID or leave the id out.`;

type WireBondInput = { padId?: string | null };

/**
 * A wire bond's padId must name a pad of the same die: stored, or created in this same request.
 * Refused with 400 naming the item, whatever team a foreign id belongs to.
 */
async function checkPadReferences(db: Db, dieId: string, shapes: readonly { kind: string; id?: string; properties: unknown }[], batch: boolean): Promise<void> {
  const wanted = new Map<string, number>();
  shapes.forEach((s, i) => {
    const padId = s.kind === "wire_bond" ? (s.properties as WireBondInput | undefined)?.padId : null;
    if (padId && !wanted.has(padId.toLowerCase())) wanted.set(padId.toLowerCase(), i);
  });
  if (wanted.size === 0) return;
  const known = new Set(shapes.flatMap((s) => (s.kind === "pad" && s.id ? [s.id.toLowerCase()] : [])));
  const ids = [...wanted.keys()].filter((id) => !known.has(id));
  for (let i = 0; i < ids.length; i += INSERT_CHUNK) {
    const chunk = ids.slice(i, i + INSERT_CHUNK);
    const rows = await db
      .select({ id: markup.id })
      .from(markup)
      .where(and(inArray(markup.id, chunk), eq(markup.dieId, dieId), eq(markup.kind, "pad")));
    for (const row of rows) known.add(row.id);
  }
  const missing = ids.find((id) => !known.has(id));
  if (missing === undefined) return;
  const where = batch ? `${wanted.get(missing)}.properties.padId` : "properties.padId";
  throw new BadRequestError(`Invalid body: ${where} does not name a pad of this die.`, [{ path: where, message: "does not name a pad of this die" }]);
}

/**
 * Creates shapes on a die in one transaction with one audit event each (owner/analyst). A
 * client-chosen id that is taken (in any team) answers the same 409 and nothing is written; a
 * wire bond's padId must name a pad of the same die (400).
 * @param batch whether the client sent an array (messages then name the item index)
 */
export async function createMarkup(db: Db, actor: Actor, dieId: string, shapes: readonly NewShapeInput[], batch: boolean): Promise<AnyShape[]> {
  try {
    return await db.transaction(async (tx) => {
      const { row: die, teamId } = await loadDie(tx, actor, dieId, "edit");
      await assertMarkupOpen(tx, dieId);
      const outside = checkInsideDie(
        shapes.map((s) => s.geometry),
        dieBounds(die),
        batch,
      );
      if (outside) throw refuse(outside);
      await checkPadReferences(tx, dieId, shapes, batch);
      const chosen = shapes.flatMap((s) => (s.id ? [s.id.toLowerCase()] : []));
      for (let i = 0; i < chosen.length; i += INSERT_CHUNK) {
        const [taken] = await tx
          .select({ id: markup.id })
          .from(markup)
          .where(inArray(markup.id, chosen.slice(i, i + INSERT_CHUNK)))
          .limit(1);
        if (taken) throw new ConflictError(takenMessage(taken.id));
      }
      const now = new Date();
      const rows: MarkupRow[] = [];
      for (let i = 0; i < shapes.length; i += INSERT_CHUNK) {
        const values = shapes.slice(i, i + INSERT_CHUNK).map((s) => ({
          ...(s.id ? { id: s.id.toLowerCase() } : {}),
          dieId,
          kind: s.kind,
          geometry: s.geometry,
          properties: s.properties,
          createdBy: actor.userId,
          updatedBy: actor.userId,
          createdAt: now,
          updatedAt: now,
        }));
        rows.push(...(await tx.insert(markup).values(values).returning()));
      }
      await auditCreations(tx, actor, teamId, rows);
      const outline = rows.find((r) => r.kind === "die_outline");
      if (outline && (await reframeToOutline(tx, actor, teamId, dieId, outline.geometry as PolygonGeometry))) {
        // The frame moved: answer with the shapes as they now are.
        const now2 = await tx
          .select()
          .from(markup)
          .where(
            inArray(
              markup.id,
              rows.map((r) => r.id),
            ),
          );
        const byId = new Map(now2.map((r) => [r.id, r]));
        return rows.map((r) => toShape(byId.get(r.id) ?? r));
      }
      return rows.map(toShape);
    });
  } catch (e) {
    // Two clients re-creating the same id at once: the second insert loses the race.
    if (isUniqueViolation(e)) throw new ConflictError(takenMessage(shapes.find((s) => s.id)?.id ?? "given"));
    throw e;
  }
}

async function conflict(db: Db, id: string, action: string): Promise<never> {
  const [current] = await db.select().from(markup).where(eq(markup.id, id));
  if (!current) throw new NotFoundError("That shape");
  throw new ConflictError(`Someone else changed this shape first (it is now at version ${current.version}); your ${action} was not saved.`, {
    current: toShape(current),
  });
}

/**
 * Changes a shape's geometry and/or properties (properties are replaced whole) if the client's
 * version is still the stored one: the check and the write are one UPDATE … WHERE version = ?,
 * so of two writers holding the same version exactly one wins and the other gets 409 with the
 * current shape.
 */
export async function updateMarkup(db: Db, actor: Actor, id: string, patch: MarkupPatch): Promise<AnyShape> {
  return db.transaction(async (tx) => {
    const { row, die } = await loadShape(tx, actor, id, "edit");
    await assertMarkupOpen(tx, row.dieId);
    if (row.version !== patch.version) return conflict(tx, id, "change");
    const parsed = parseShapeOfKind(row.kind, patch.geometry ?? row.geometry, patch.properties ?? row.properties);
    if (!parsed.ok) throw refuse(parsed.failure);
    if (patch.geometry) {
      const outside = checkInsideDie([parsed.value.geometry], dieBounds(die.row), false);
      if (outside) throw refuse(outside);
    }
    if (patch.properties) await checkPadReferences(tx, row.dieId, [{ kind: row.kind, properties: parsed.value.properties }], false);
    const [after] = await tx
      .update(markup)
      .set({
        geometry: parsed.value.geometry,
        properties: parsed.value.properties,
        version: sql`${markup.version} + 1`,
        updatedBy: actor.userId,
        updatedAt: new Date(),
      })
      .where(and(eq(markup.id, id), eq(markup.version, patch.version)))
      .returning();
    if (!after) return conflict(tx, id, "change");
    await recordAudit(tx, actor, { teamId: die.teamId, action: "markup.updated", entityType: "markup", entityId: id, dieId: row.dieId, before: row, after });
    if (after.kind === "die_outline" && patch.geometry && (await reframeToOutline(tx, actor, die.teamId, row.dieId, after.geometry as PolygonGeometry))) {
      const [moved] = await tx.select().from(markup).where(eq(markup.id, id));
      return toShape(moved);
    }
    return toShape(after);
  });
}

/** Deletes a shape (owner/analyst); with `version`, only if that is still the stored one (else 409). */
export async function deleteMarkup(db: Db, actor: Actor, id: string, version?: number): Promise<void> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadShape(tx, actor, id, "edit");
    await assertMarkupOpen(tx, row.dieId);
    const where = version === undefined ? eq(markup.id, id) : and(eq(markup.id, id), eq(markup.version, version));
    const [gone] = await tx.delete(markup).where(where).returning();
    if (!gone) return conflict(tx, id, "deletion");
    await recordAudit(tx, actor, { teamId: die.teamId, action: "markup.deleted", entityType: "markup", entityId: id, dieId: row.dieId, before: gone });
  });
}

/**
 * All shapes of a die as one JSON text built by the database, with an ETag over their ids,
 * versions and update times: thousands of shapes are sent without being parsed into objects
 * and serialised again in the server (the list view's hot path).
 */
export async function listMarkupJson(db: Db, actor: Actor, dieId: string): Promise<{ json: string; etag: string }> {
  await loadDie(db, actor, dieId, "read");
  const stamp = sql`to_char(${markup.updatedAt} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
  const result = (await db.execute(sql`
    select coalesce(json_agg(json_build_object(
             'id', ${markup.id}, 'kind', ${markup.kind}, 'geometry', ${markup.geometry}, 'properties', ${markup.properties},
             'version', ${markup.version}, 'createdBy', ${markup.createdBy}, 'updatedAt', ${stamp}) order by ${markup.seq}), '[]')::text as json,
           md5(coalesce(string_agg(${markup.id}::text || ':' || ${markup.version} || ':' || ${stamp}, ',' order by ${markup.id}), '')) as tag
    from ${markup} where ${markup.dieId} = ${dieId}`)) as unknown as { rows: { json: string; tag: string }[] };
  const row = result.rows[0];
  return { json: row.json, etag: `"m-${row.tag}"` };
}
