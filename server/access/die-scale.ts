import "server-only";
import { and, eq } from "drizzle-orm";
import { micrographs } from "@/db/schema";
import type { Db } from "./context";

/**
 * The scale (µm per pixel) of a die's reference micrograph, or null: what decides how many
 * decimals µm values get in exports (lib/units/format-um.ts). Call after the caller has been
 * authorized for the die.
 */
export async function referenceScale(db: Db, dieId: string): Promise<number | null> {
  const [row] = await db
    .select({ scale: micrographs.scaleUmPerPx })
    .from(micrographs)
    .where(and(eq(micrographs.dieId, dieId), eq(micrographs.isReference, true)))
    .limit(1);
  return row?.scale ?? null;
}
