import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { cases, dies, markup, micrographs, threads, users, type MicrographRow } from "@/db/schema";
import type { Db } from "./context";
import { boundingBox, polygonCentroid } from "@/lib/geometry/measure";
import type { ExtentUm } from "@/lib/export/view-region";
import type { Affine2x3, Geometry, Position } from "@/lib/geometry/types";
import type { AnyShape, MarkupKind } from "@/lib/markup/types";
import type { ThreadMark } from "@/lib/export/markup-svg";
import type { TitleBlock } from "@/lib/export/footer-svg";
import { ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import { withShownPadStates } from "@/lib/markup/pad-state";
import { revisionStatement } from "@/lib/review/revision-text";
import type { RevisionStamp } from "@/lib/dto/revisions";
import type { ReviewStatus } from "@/lib/dto/stored-values";
import { revisionStamp } from "./revisions";

/** Everything an export of one die needs, read after the caller was authorized. */
export type DieSources = {
  die: {
    id: string;
    name: string;
    widthUm: number | null;
    heightUm: number | null;
    reviewStatus: ReviewStatus;
    /** The revision the markup belongs to and its sign-off. */
    revision: RevisionStamp;
    notes: string;
    analystName: string | null;
    extentUm: ExtentUm | null;
  };
  caseRow: { title: string; partMarking: string; package: string; sampleId: string };
  shapes: AnyShape[];
};

/** The die, its case and its markup in creation order (no authorization: callers check first). */
export async function loadDieSources(db: Db, dieId: string): Promise<DieSources | null> {
  const [found] = await db
    .select({ die: dies, c: cases, analystName: users.name })
    .from(dies)
    .innerJoin(cases, eq(cases.id, dies.caseId))
    .leftJoin(users, eq(users.id, dies.analystId))
    .where(eq(dies.id, dieId));
  if (!found) return null;
  const rows = await db.select().from(markup).where(eq(markup.dieId, dieId)).orderBy(asc(markup.seq));
  const shapes = rows.map(
    (r) =>
      ({
        id: r.id,
        kind: r.kind,
        geometry: r.geometry,
        properties: r.properties,
        version: r.version,
        createdBy: r.createdBy,
        updatedAt: r.updatedAt.toISOString(),
      }) as AnyShape,
  );
  const d = found.die;
  return {
    die: {
      id: d.id,
      name: d.name,
      widthUm: d.widthUm,
      heightUm: d.heightUm,
      reviewStatus: d.reviewStatus,
      revision: await revisionStamp(db, d),
      notes: d.notes,
      analystName: found.analystName,
      extentUm: markupExtent(shapes),
    },
    caseRow: { title: found.c.title, partMarking: found.c.partMarking, package: found.c.package, sampleId: found.c.sampleId },
    shapes,
  };
}

/** What the shapes cover in die µm (null without shapes): a whole-die export takes it in. */
function markupExtent(shapes: readonly AnyShape[]): ExtentUm | null {
  if (shapes.length === 0) return null;
  const boxes = shapes.map((s) => boundingBox(s.geometry));
  return {
    minX: Math.min(...boxes.map((b) => b.minX)),
    minY: Math.min(...boxes.map((b) => b.minY)),
    maxX: Math.max(...boxes.map((b) => b.maxX)),
    maxY: Math.max(...boxes.map((b) => b.maxY)),
  };
}

/** The extent of a die's markup, read on its own (for checks that need nothing else). */
export async function loadMarkupExtent(db: Db, dieId: string): Promise<ExtentUm | null> {
  const rows = await db.select({ geometry: markup.geometry }).from(markup).where(eq(markup.dieId, dieId));
  return markupExtent(rows.map((r) => ({ geometry: r.geometry }) as AnyShape));
}

/** A micrograph of the die (or null when it is not one of the die's). */
export async function loadDieMicrograph(db: Db, dieId: string, micrographId: string): Promise<MicrographRow | null> {
  const [row] = await db
    .select()
    .from(micrographs)
    .where(and(eq(micrographs.id, micrographId), eq(micrographs.dieId, dieId)));
  return row ?? null;
}

function anchorPoint(anchor: unknown): Position | null {
  const g = anchor as Geometry | null;
  if (g?.type === "Point") return g.coordinates;
  if (g?.type === "Polygon") return polygonCentroid(g);
  return null;
}

/** The die's review threads as numbered markers, oldest first. */
export async function loadThreadMarks(db: Db, dieId: string): Promise<ThreadMark[]> {
  const rows = await db
    .select({ anchor: threads.anchor, status: threads.status })
    .from(threads)
    .where(eq(threads.dieId, dieId))
    .orderBy(asc(threads.createdAt));
  return rows.flatMap((r, i) => {
    const at = anchorPoint(r.anchor);
    return at ? [{ at, open: r.status === "open", number: i + 1 }] : [];
  });
}

/**
 * Only the shapes of the chosen kinds (all when none are chosen), pads carrying the state they
 * show (from their bonds, counted before the bonds may be left out).
 */
export function shapesOfKinds(shapes: readonly AnyShape[], kinds?: readonly MarkupKind[]): AnyShape[] {
  const shown = withShownPadStates(shapes);
  if (!kinds) return shown;
  const keep = new Set(kinds);
  return shown.filter((s) => keep.has(s.kind));
}

/** The title block of an export of this micrograph, dated today (UTC). */
export function titleBlockFor(src: DieSources, m: MicrographRow, umPerPx: number, author: string, date = new Date()): TitleBlock {
  return {
    caseTitle: src.caseRow.title,
    dieName: src.die.name,
    micrograph: m.label,
    illumination: ILLUMINATION_LABELS[m.illumination],
    umPerPx,
    date: date.toISOString().slice(0, 10),
    author,
    revision: revisionStatement(src.die.revision),
  };
}

/** The micrograph's size and transform as the planner takes them, or null when not in the die frame. */
export function sourceImageOf(m: MicrographRow): { width: number; height: number; transform: Affine2x3 } | null {
  if (!m.transform || !m.width || !m.height) return null;
  return { width: m.width, height: m.height, transform: m.transform };
}
