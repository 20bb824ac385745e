import "server-only";
import { and, eq } from "drizzle-orm";
import { imageSearches, markup, type ImageSearchRow, type MicrographRow } from "@/db/schema";
import { queueJob } from "./job-queue";
import { type Actor, type Db } from "./context";
import { loadDieOf } from "./dies";
import { loadMicrograph } from "./micrographs";
import { BadRequestError, ConflictError, NotFoundError } from "@/lib/errors";
import { invertAffine } from "@/lib/geometry/affine";
import { boundingBox } from "@/lib/geometry/measure";
import type { Affine2x3 } from "@/lib/geometry/types";
import { regionProblem, shapeBoxPx, templateBoxProblem } from "@/lib/similar-shapes/template";
import type { ImageSearchParams } from "@/lib/similar-shapes/params";
import { SEARCHABLE_KINDS, type FindSimilarRequest } from "@/lib/validation/find-similar";
import type { FindSimilarJobDto } from "@/lib/dto/find-similar";
import { KIND_STYLE } from "@/lib/markup/palette";

/** A micrograph whose pixels can be searched: tiled, with its size, format and place in the die frame. */
export type SearchableMicrograph = MicrographRow & { width: number; height: number; format: string; transform: NonNullable<MicrographRow["transform"]> };

/**
 * 409 unless the micrograph's pixels can be read (it is tiled) and mapped to the die frame (it
 * has a transform); answers the row narrowed to what a search reads.
 */
export function assertSearchable(m: MicrographRow): SearchableMicrograph {
  if (m.status === "failed") throw new ConflictError("That micrograph failed to process; upload it again before searching it.");
  if (m.status !== "ready" || !m.width || !m.height || !m.format) {
    throw new ConflictError(`That micrograph is not tiled yet (${m.status}, ${m.progress} %); search it once it is ready.`);
  }
  if (!m.transform) throw new ConflictError("That micrograph is not in the die frame yet: set its scale or align it to the reference, then search.");
  return m as SearchableMicrograph;
}

function toDto(row: ImageSearchRow): FindSimilarJobDto {
  const dto: FindSimilarJobDto = { jobId: row.id, status: row.status, progress: row.progress, kind: row.params.kind };
  if (row.status === "failed") dto.error = row.error ?? "The search failed.";
  if (row.status === "done" && row.result) Object.assign(dto, row.result);
  return dto;
}

/** The template of a `shapeId` request: a pad or block of the micrograph's die, mapped to its pixels. */
async function shapeTemplate(db: Db, m: SearchableMicrograph, shapeId: string) {
  const [shape] = await db
    .select()
    .from(markup)
    .where(and(eq(markup.id, shapeId), eq(markup.dieId, m.dieId)));
  if (!shape) throw new NotFoundError("That shape on this micrograph's die");
  if (!(SEARCHABLE_KINDS as readonly string[]).includes(shape.kind) || shape.geometry.type !== "Polygon") {
    throw new BadRequestError(`Find similar starts from a pad or a block; that shape is a ${KIND_STYLE[shape.kind].label.toLowerCase()}.`);
  }
  const dieToImage = invertAffine(m.transform as Affine2x3);
  const box = shapeBoxPx(shape.geometry.coordinates[0], dieToImage, m);
  if (!box) throw new BadRequestError("That shape lies outside this micrograph.");
  const b = boundingBox(shape.geometry);
  return { box, kind: shape.kind as ImageSearchParams["kind"], sizeUm: [b.maxX - b.minX, b.maxY - b.minY] as [number, number] };
}

/**
 * Queues a search for places on a micrograph that look like a template (a pad or block of its
 * die, or a box of its pixels). Marking is editing, so owners and analysts only. Every check
 * (micrograph tiled and in the die frame, template and region inside the image and of a
 * searchable size) runs before the row and its job are written, in one transaction.
 */
export async function createImageSearch(db: Db, actor: Actor, micrographId: string, req: FindSimilarRequest): Promise<FindSimilarJobDto> {
  return db.transaction(async (tx) => {
    const { row } = await loadMicrograph(tx, actor, micrographId, "edit");
    const m = assertSearchable(row);
    const template = req.shapeId ? await shapeTemplate(tx, m, req.shapeId) : { box: req.box!, kind: req.kind ?? "pad", sizeUm: null };
    const problem = templateBoxProblem(template.box, m) ?? (req.region ? regionProblem(req.region, template.box, m) : null);
    if (problem) throw new BadRequestError(problem);
    const params: ImageSearchParams = {
      template: template.box,
      shapeId: req.shapeId ?? null,
      kind: template.kind,
      sizeUm: template.sizeUm,
      minScore: req.minScore,
      rotations: [...req.rotations],
      mirrored: req.mirrored,
      region: req.region ?? null,
    };
    const [created] = await tx.insert(imageSearches).values({ dieId: m.dieId, micrographId: m.id, params, createdBy: actor.userId }).returning();
    await queueJob(tx, "find", created.id);
    return toDto(created);
  });
}

/** A search's status and, once done, its candidates; searching is editing, so the same roles may poll it. */
export async function getImageSearch(db: Db, actor: Actor, micrographId: string, searchId: string): Promise<FindSimilarJobDto> {
  const [row] = await db
    .select()
    .from(imageSearches)
    .where(and(eq(imageSearches.id, searchId), eq(imageSearches.micrographId, micrographId)));
  await loadDieOf(db, actor, row, "edit", "That search");
  return toDto(row);
}
