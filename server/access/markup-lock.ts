import "server-only";
import { eq } from "drizzle-orm";
import { dies } from "@/db/schema";
import { LockedError } from "@/lib/errors";
import { lockReason, markupLocked } from "@/lib/review/review-status";
import type { Db } from "./context";

/**
 * Refuses a markup write (423) while the die is with the checker or signed off. Reads the
 * status FOR SHARE, so on PostgreSQL a write waits for a sign-off that is committing and then
 * sees it, and a sign-off (which updates the row) waits for writes already past this check:
 * what is frozen is exactly what was there. Call inside the write's transaction, after the
 * caller has been authorized for the die.
 */
export async function assertMarkupOpen(tx: Db, dieId: string): Promise<void> {
  const [row] = await tx.select({ reviewStatus: dies.reviewStatus }).from(dies).where(eq(dies.id, dieId)).for("share");
  if (row && markupLocked(row.reviewStatus)) throw new LockedError(lockReason(row.reviewStatus), { reviewStatus: row.reviewStatus });
}
