import "server-only";
import { eq, sql } from "drizzle-orm";
import { dies, markup, micrographs, threads, type MarkupRow } from "../schema";
import type { Actor, Db } from "./context";
import { recordAudit } from "./audit";
import { BadRequestError } from "@/lib/server/errors";
import { dieFrameFromOutline } from "@/lib/pads/die-frame";
import { translateGeometry } from "@/lib/geometry/transform-geometry";
import type { Geometry, PolygonGeometry } from "@/lib/geometry/types";

type Transform = [[number, number, number], [number, number, number]];

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
  if (moved) {
    const rows: MarkupRow[] = await tx.select().from(markup).where(eq(markup.dieId, dieId));
    for (const r of rows) {
      await tx
        .update(markup)
        .set({ geometry: translateGeometry(r.geometry as Geometry, -dx, -dy), version: sql`${markup.version} + 1`, updatedAt: new Date(), updatedBy: actor.userId })
        .where(eq(markup.id, r.id));
    }
    for (const t of await tx.select().from(threads).where(eq(threads.dieId, dieId))) {
      await tx.update(threads).set({ anchor: translateGeometry(t.anchor as Geometry, -dx, -dy) }).where(eq(threads.id, t.id));
    }
    for (const m of await tx.select().from(micrographs).where(eq(micrographs.dieId, dieId))) {
      const t = m.transform as Transform | null;
      await tx
        .update(micrographs)
        .set({
          transform: t ? [[t[0][0], t[0][1], t[0][2] - dx], [t[1][0], t[1][1], t[1][2] - dy]] : null,
          controlPoints: m.controlPoints?.map((p) => ({ imagePx: p.imagePx, dieUm: [p.dieUm[0] - dx, p.dieUm[1] - dy] as [number, number] })) ?? null,
        })
        .where(eq(micrographs.id, m.id));
    }
  }
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
