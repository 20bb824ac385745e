import "server-only";
import crypto from "node:crypto";
import { and, asc, desc, eq, sql } from "drizzle-orm";
import { dieRevisions, dies, markup, micrographs, reviewEvents, users, type DieRow } from "@/db/schema";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { padTableFromMarkup } from "@/lib/markup/pad-table-from-markup";
import type { FrozenDieFrame, FrozenPadTable, RevisionDto, RevisionStamp } from "@/lib/dto/revisions";
import type { Database } from "@/db/client";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import { listMarkup, toShape } from "./markup";
import { markupGeojson } from "./markup-geojson";
import { recordAudit } from "./audit";

const sha256 = (text: string) => crypto.createHash("sha256").update(text, "utf8").digest("hex");

/** Revisions of a die, oldest first: the signed-off ones, then the one being drawn or checked. */
export async function listRevisions(db: Db, actor: Actor, dieId: string): Promise<RevisionDto[]> {
  const { row } = await loadDie(db, actor, dieId, "read");
  const frozen = await db.select().from(dieRevisions).where(eq(dieRevisions.dieId, dieId)).orderBy(asc(dieRevisions.number));
  const list: RevisionDto[] = frozen.map((r) => ({
    number: r.number,
    status: "signed_off",
    signedOffBy: r.signedOffByName,
    signedOffAt: r.signedOffAt.toISOString(),
    sha256: r.sha256,
    shapeCount: r.shapeCount,
  }));
  if (!frozen.some((r) => r.number === row.revision)) {
    const [{ n }] = await db
      .select({ n: sql<number>`count(*)::int` })
      .from(markup)
      .where(eq(markup.dieId, dieId));
    list.push({ number: row.revision, status: row.reviewStatus, shapeCount: n });
  }
  return list;
}

/** What exports state about the die's current revision. Call after authorizing the caller. */
export async function revisionStamp(db: Db, die: Pick<DieRow, "id" | "revision" | "reviewStatus">): Promise<RevisionStamp> {
  const [r] = await db
    .select()
    .from(dieRevisions)
    .where(and(eq(dieRevisions.dieId, die.id), eq(dieRevisions.number, die.revision)));
  return r
    ? { number: r.number, status: "signed_off", signedOffBy: r.signedOffByName, signedOffAt: r.signedOffAt.toISOString() }
    : { number: die.revision, status: die.reviewStatus, signedOffBy: null, signedOffAt: null };
}

/**
 * A revision's markup as GeoJSON: a signed-off one byte for byte as it was signed (so its
 * SHA-256 matches the list), the one being drawn as it is now. 404 for a number the die never had.
 */
export async function revisionGeojson(db: Db, actor: Actor, dieId: string, n: number): Promise<{ json: string; dieName: string; sha256: string }> {
  const { row } = await loadDie(db, actor, dieId, "export");
  const [r] = await db
    .select()
    .from(dieRevisions)
    .where(and(eq(dieRevisions.dieId, dieId), eq(dieRevisions.number, n)));
  if (r) return { json: r.markupGeojson, dieName: row.name, sha256: r.sha256 };
  if (n !== row.revision) throw new NotFoundError(`Revision ${n} of this die`);
  const { shapes } = await listMarkup(db, actor, dieId, "export");
  const json = await markupGeojson(db, row, shapes, await revisionStamp(db, row));
  return { json, dieName: row.name, sha256: sha256(json) };
}

/**
 * Freezes the die's current revision as signed off by `signer` at `at`: canonical GeoJSON and
 * its SHA-256, the pad table and the die frame. Runs inside the sign-off's transaction, after
 * the status update has locked the die row.
 */
export async function freezeRevision(tx: Db, die: DieRow, signer: { id: string | null; name: string }, at: Date, overrideOpenRemarks: boolean): Promise<void> {
  const rows = await tx.select().from(markup).where(eq(markup.dieId, die.id)).orderBy(asc(markup.seq));
  const shapes = rows.map(toShape);
  const stamp: RevisionStamp = { number: die.revision, status: "signed_off", signedOffBy: signer.name, signedOffAt: at.toISOString() };
  const json = await markupGeojson(tx, die, shapes, stamp);
  const pads = padTableFromMarkup(shapes, die);
  const padTable: FrozenPadTable = pads.ok ? { table: pads.table } : { unavailable: pads.message };
  await tx.insert(dieRevisions).values({
    dieId: die.id,
    number: die.revision,
    markupGeojson: json,
    sha256: sha256(json),
    shapeCount: shapes.length,
    padTable,
    dieFrame: await dieFrameOf(tx, die),
    signedOffBy: signer.id,
    signedOffByName: signer.name,
    signedOffAt: at,
    overrideOpenRemarks,
  });
}

async function dieFrameOf(tx: Db, die: DieRow): Promise<FrozenDieFrame> {
  const [ref] = await tx
    .select()
    .from(micrographs)
    .where(and(eq(micrographs.dieId, die.id), eq(micrographs.isReference, true)));
  return {
    widthUm: die.widthUm,
    heightUm: die.heightUm,
    reference: ref ? { micrographId: ref.id, label: ref.label, transform: ref.transform, scaleUmPerPx: ref.scaleUmPerPx } : null,
  };
}

/**
 * Opens revision N+1 of a signed-off die in draft, its markup carried forward (the live
 * shapes stay; revision N stays readable as it was frozen). Analyst or owner (the edit right).
 */
export async function openNextRevision(db: Db, actor: Actor, dieId: string): Promise<RevisionDto> {
  return db.transaction(async (tx) => {
    const { row, teamId } = await loadDie(tx, actor, dieId, "edit");
    if (row.reviewStatus !== "signed_off") {
      throw new ConflictError(`Revision ${row.revision} is not signed off yet: a new revision opens only after sign-off.`, { reviewStatus: row.reviewStatus });
    }
    const [after] = await tx
      .update(dies)
      .set({ revision: row.revision + 1, reviewStatus: "draft", updatedAt: new Date() })
      .where(and(eq(dies.id, dieId), eq(dies.revision, row.revision), eq(dies.reviewStatus, "signed_off")))
      .returning();
    if (!after) throw new ConflictError("Someone else opened a new revision first; reload to see it.");
    await recordAudit(tx, actor, {
      teamId,
      action: "revision.opened",
      entityType: "die",
      entityId: dieId,
      dieId,
      before: { revision: row.revision, reviewStatus: row.reviewStatus },
      after: { revision: after.revision, reviewStatus: after.reviewStatus },
    });
    const [{ n }] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(markup)
      .where(eq(markup.dieId, dieId));
    return { number: after.revision, status: after.reviewStatus, shapeCount: n };
  });
}

/**
 * Freezes signed-off dies that have no frozen revision: dies approved before revisions existed
 * (the migration renamed their state). The signer is the last sign-off in the history. Run at start.
 */
export async function freezeUnfrozenSignOffs(db: Database): Promise<number> {
  const open = await db
    .select({ die: dies })
    .from(dies)
    .leftJoin(dieRevisions, and(eq(dieRevisions.dieId, dies.id), eq(dieRevisions.number, dies.revision)))
    .where(and(eq(dies.reviewStatus, "signed_off"), sql`${dieRevisions.id} is null`));
  for (const { die } of open) {
    await db.transaction(async (tx) => {
      const [last] = await tx
        .select({ actorId: reviewEvents.actorId, at: reviewEvents.at, name: users.name })
        .from(reviewEvents)
        .leftJoin(users, eq(users.id, reviewEvents.actorId))
        .where(and(eq(reviewEvents.dieId, die.id), eq(reviewEvents.action, "sign_off")))
        .orderBy(desc(reviewEvents.at))
        .limit(1);
      await freezeRevision(tx, die, { id: last?.actorId ?? null, name: last?.name ?? "former member" }, last?.at ?? die.updatedAt, false);
    });
  }
  return open.length;
}
