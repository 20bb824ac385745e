import "server-only";
import { eq } from "drizzle-orm";
import { micrographs } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { assertMarkupOpen } from "./markup-lock";
import { loadDie } from "./dies";
import { getMicrograph, listMicrographs, loadMicrograph } from "./micrographs";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { recordAudit } from "./audit";
import { BadRequestError } from "@/lib/errors";

/**
 * Makes a micrograph the die's reference. Markup lives in the die frame and every aligned
 * micrograph's transform already maps into that frame, so nothing is recomputed and nothing
 * moves: the new reference keeps its transform. One not yet in the frame cannot take over.
 */
export async function setReference(db: Db, actor: Actor, id: string): Promise<MicrographDto> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadMicrograph(tx, actor, id, "edit");
    await assertMarkupOpen(tx, row.dieId);
    if (!row.transform) throw new BadRequestError("Align this micrograph to the die frame before making it the reference.");
    if (row.isReference) return;
    const old = (await tx.select({ id: micrographs.id, isReference: micrographs.isReference }).from(micrographs).where(eq(micrographs.dieId, row.dieId))).find(
      (m) => m.isReference,
    );
    await tx.update(micrographs).set({ isReference: false }).where(eq(micrographs.dieId, row.dieId));
    await tx.update(micrographs).set({ isReference: true, updatedAt: new Date() }).where(eq(micrographs.id, id));
    await recordAudit(tx, actor, {
      teamId: die.teamId,
      action: "micrograph.reference_changed",
      entityType: "die",
      entityId: row.dieId,
      dieId: row.dieId,
      before: { referenceId: old?.id ?? null },
      after: { referenceId: id },
    });
  });
  return getMicrograph(db, actor, id);
}

/**
 * Puts a die's micrographs in the given order (positions 0, 1, …). The list must name every
 * micrograph of the die exactly once, so a stale list from another tab is refused, not merged.
 */
export async function reorderMicrographs(db: Db, actor: Actor, dieId: string, ids: readonly string[]): Promise<MicrographDto[]> {
  await db.transaction(async (tx) => {
    const { teamId } = await loadDie(tx, actor, dieId, "edit");
    const rows = await tx.select({ id: micrographs.id, position: micrographs.position }).from(micrographs).where(eq(micrographs.dieId, dieId));
    const known = new Set(rows.map((r) => r.id));
    if (new Set(ids).size !== ids.length) throw new BadRequestError("The order names a micrograph twice.");
    if (ids.length !== rows.length || !ids.every((i) => known.has(i))) {
      throw new BadRequestError("The order must list every micrograph of this die exactly once; reload and try again.");
    }
    for (const [position, id] of ids.entries()) await tx.update(micrographs).set({ position }).where(eq(micrographs.id, id));
    const before = [...rows].sort((a, b) => a.position - b.position).map((r) => r.id);
    await recordAudit(tx, actor, {
      teamId,
      action: "micrograph.reordered",
      entityType: "die",
      entityId: dieId,
      dieId,
      before: { order: before },
      after: { order: ids },
    });
  });
  return listMicrographs(db, actor, dieId);
}
