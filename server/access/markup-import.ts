import "server-only";
import { loadDie } from "./dies";
import { createMarkup } from "./markup";
import { type Actor, type Db } from "./context";
import { assertMarkupOpen } from "./markup-lock";
import { BadRequestError } from "@/lib/errors";
import { dieBounds } from "@/lib/markup/die-bounds";
import { parseMarkupImport } from "@/lib/export/geojson-import";
import type { MarkupKind } from "@/lib/markup/types";
import type { NewShapeInput } from "@/lib/validation/markup";

export type ImportResult = {
  dryRun: boolean;
  total: number;
  counts: Partial<Record<MarkupKind, number>>;
  unlinkedWireBonds: number;
  /** The shapes as they would be (dry run) or were created. */
  features: NewShapeInput[];
};

/**
 * Imports a GeoJSON FeatureCollection into a die (owner/analyst), all or nothing, in one
 * transaction with one audit event per shape. A dry run checks the same rights and the same
 * rules and writes nothing.
 */
export async function importMarkup(db: Db, actor: Actor, dieId: string, body: unknown, dryRun: boolean): Promise<ImportResult> {
  const { row } = await loadDie(db, actor, dieId, "edit");
  // A fixed die says so before any word about the file (createMarkup checks again, in its transaction).
  if (!dryRun) await assertMarkupOpen(db, dieId);
  const parsed = parseMarkupImport(body, dieBounds(row));
  if (!parsed.ok) throw new BadRequestError(parsed.failure.message, parsed.failure.issues);
  const { shapes, counts, unlinkedWireBonds } = parsed.value;
  if (!dryRun) await createMarkup(db, actor, dieId, shapes, true);
  return { dryRun, total: shapes.length, counts, unlinkedWireBonds, features: [...shapes] };
}
