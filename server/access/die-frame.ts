import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { dies, markup, micrographs, threads, type MarkupRow } from "@/db/schema";
import type { Actor, Db } from "./context";
import { assertMarkupOpen } from "./markup-lock";
import { recordAudit } from "./audit";
import { loadDie } from "./dies";
import { BadRequestError } from "@/lib/errors";
import { dieFrameFromOutline } from "@/lib/pads/die-frame";
import { translateGeometry } from "@/lib/geometry/transform-geometry";
import type { Geometry, PolygonGeometry, Position } from "@/lib/geometry/types";
import type { Transform } from "@/lib/geometry/types";

/**
 * Puts the die frame's origin at `origin` (a point in the current frame): every shape, thread
 * anchor, micrograph transform and control point moves by −origin, so nothing moves against
 * the image. The one path both re-framing and its undo take.
 */
async function moveFrameOrigin(tx: Db, actor: Actor, dieId: string, origin: Position): Promise<void> {
  const [dx, dy] = origin;
  const rows: MarkupRow[] = await tx.select().from(markup).where(eq(markup.dieId, dieId));
  for (const r of rows) {
    await tx
      .update(markup)
      .set({
        geometry: translateGeometry(r.geometry as Geometry, -dx, -dy),
        version: sql`${markup.version} + 1`,
        updatedAt: new Date(),
        updatedBy: actor.userId,
      })
      .where(eq(markup.id, r.id));
  }
  for (const t of await tx.select().from(threads).where(eq(threads.dieId, dieId))) {
    await tx
      .update(threads)
      .set({ anchor: translateGeometry(t.anchor as Geometry, -dx, -dy) })
      .where(eq(threads.id, t.id));
  }
  for (const m of await tx.select().from(micrographs).where(eq(micrographs.dieId, dieId))) {
    const t = m.transform as Transform | null;
    await tx
      .update(micrographs)
      .set({
        transform: t
          ? [
              [t[0][0], t[0][1], t[0][2] - dx],
              [t[1][0], t[1][1], t[1][2] - dy],
            ]
          : null,
        controlPoints: m.controlPoints?.map((p) => ({ imagePx: p.imagePx, dieUm: [p.dieUm[0] - dx, p.dieUm[1] - dy] as [number, number] })) ?? null,
      })
      .where(eq(micrographs.id, m.id));
  }
}

/**
 * Makes a die outline define the die frame: its lower-left corner becomes the origin and its
 * sides the die's width and height. Everything in the frame moves by the same offset in one
 * transaction — all markup, thread anchors, every micrograph's transform and control points —
 * so nothing moves against the image. Rotated outlines keep their rotation (the pad table
 * reads the die in the outline's own axes); only the origin is translated.
 */
export async function reframeToOutline(tx: Db, actor: Actor, teamId: string, dieId: string, outline: PolygonGeometry): Promise<boolean> {
  let frame;
  try {
    frame = dieFrameFromOutline(outline);
  } catch (e) {
    throw new BadRequestError(`The die outline must be a rectangle: ${(e as Error).message}`);
  }
  const [dx, dy] = frame.origin;
  const [die] = await tx.select().from(dies).where(eq(dies.id, dieId));
  const sizeChanged = die.widthUm !== frame.widthUm || die.heightUm !== frame.heightUm;
  const moved = Math.abs(dx) > 1e-9 || Math.abs(dy) > 1e-9;
  if (!moved && !sizeChanged) return false;
  if (moved) await moveFrameOrigin(tx, actor, dieId, [dx, dy]);
  await tx.update(dies).set({ widthUm: frame.widthUm, heightUm: frame.heightUm, updatedAt: new Date() }).where(eq(dies.id, dieId));
  await recordAudit(tx, actor, {
    teamId,
    action: "die.reframed",
    entityType: "die",
    entityId: dieId,
    dieId,
    before: { widthUm: die.widthUm, heightUm: die.heightUm },
    after: { widthUm: frame.widthUm, heightUm: frame.heightUm, originShiftUm: [-dx, -dy] },
  });
  return true;
}

/** The frame to go back to, as the client remembers it from before a re-framing. */
export type FrameRestore = {
  /** Where the earlier frame's origin lies in the current frame, µm. */
  readonly originUm: Position;
  /** The earlier size, used when no outline is given (null: it was not known). */
  readonly widthUm: number | null;
  readonly heightUm: number | null;
  /** The earlier die outline in the earlier frame's coordinates, or null when there was none. */
  readonly outline: PolygonGeometry | null;
};

/**
 * Undoes a re-framing (owner/analyst) in one transaction: the current die outline is removed,
 * the origin goes back to `originUm` through the same move as re-framing, and the earlier
 * outline (re-created, re-framing from it) or the earlier size is put back. Returns how many
 * shapes moved.
 */
export async function restoreDieFrame(db: Db, actor: Actor, dieId: string, input: FrameRestore): Promise<{ moved: number }> {
  if (input.outline) {
    try {
      dieFrameFromOutline(input.outline);
    } catch (e) {
      throw new BadRequestError(`Invalid body: outline: the die outline must be a rectangle: ${(e as Error).message}`);
    }
  }
  return db.transaction(async (tx) => {
    const { row: die, teamId } = await loadDie(tx, actor, dieId, "edit");
    await assertMarkupOpen(tx, dieId);
    const gone = await tx
      .delete(markup)
      .where(and(eq(markup.dieId, dieId), eq(markup.kind, "die_outline")))
      .returning();
    for (const row of gone) await recordAudit(tx, actor, { teamId, action: "markup.deleted", entityType: "markup", entityId: row.id, dieId, before: row });
    await moveFrameOrigin(tx, actor, dieId, input.originUm);
    const moved = (await tx.select({ id: markup.id }).from(markup).where(eq(markup.dieId, dieId))).length;
    await tx.update(dies).set({ widthUm: input.widthUm, heightUm: input.heightUm, updatedAt: new Date() }).where(eq(dies.id, dieId));
    if (input.outline) {
      const now = new Date();
      const [row] = await tx
        .insert(markup)
        .values({
          dieId,
          kind: "die_outline",
          geometry: input.outline,
          properties: {},
          createdBy: actor.userId,
          updatedBy: actor.userId,
          createdAt: now,
          updatedAt: now,
        })
        .returning();
      await recordAudit(tx, actor, { teamId, action: "markup.created", entityType: "markup", entityId: row.id, dieId, after: row });
      // The earlier outline sets the earlier size (and, were it not at the origin, the origin).
      await reframeToOutline(tx, actor, teamId, dieId, input.outline);
    }
    await recordAudit(tx, actor, {
      teamId,
      action: "die.frame_restored",
      entityType: "die",
      entityId: dieId,
      dieId,
      before: { widthUm: die.widthUm, heightUm: die.heightUm },
      after: { widthUm: input.widthUm, heightUm: input.heightUm, originShiftUm: [-input.originUm[0], -input.originUm[1]], outline: input.outline !== null },
    });
    return { moved };
  });
}
