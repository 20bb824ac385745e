import "server-only";
import { eq } from "drizzle-orm";
import { mosaics } from "@/db/schema";
import { ConflictError } from "@/lib/errors";
import type { Restitch } from "@/lib/validation/mosaics";
import { queueJob } from "./job-queue";
import { loadMicrograph } from "./micrographs";
import { recordAudit } from "./audit";
import type { Actor, Db } from "./context";

/**
 * Stitch again with another overlap, order or shading choice (owner/analyst). The result being
 * served stays until the new one is stored; 409 while the micrograph is not ready or a stitch is
 * already under way.
 */
export async function restitchMosaic(db: Db, actor: Actor, micrographId: string, change: Restitch): Promise<void> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadMicrograph(tx, actor, micrographId, "edit");
    const [m] = await tx.select().from(mosaics).where(eq(mosaics.micrographId, micrographId));
    if (!m) throw new ConflictError("This micrograph was not stitched from frames.");
    if (row.status !== "ready" || m.restitching)
      throw new ConflictError(`Stitch again once the current stitch is finished; this one is ${m.restitching ? "being stitched again" : row.status}.`);
    const next = { order: change.order ?? m.order, overlapPercent: change.overlapPercent ?? m.overlapPercent, flatField: change.flatField ?? m.flatField };
    await tx
      .update(mosaics)
      .set({ ...next, restitching: true, stage: "checking", stageProgress: 0, updatedAt: new Date() })
      .where(eq(mosaics.micrographId, micrographId));
    await queueJob(tx, "stitch", micrographId);
    await recordAudit(tx, actor, {
      teamId: die.teamId,
      action: "micrograph.restitched",
      entityType: "micrograph",
      entityId: micrographId,
      dieId: row.dieId,
      before: { order: m.order, overlapPercent: m.overlapPercent, flatField: m.flatField },
      after: next,
    });
  });
}
