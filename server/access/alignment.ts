import "server-only";
import { eq } from "drizzle-orm";
import { micrographs, type MicrographRow } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { assertMarkupOpen } from "./markup-lock";
import { loadMicrograph } from "./micrographs";
import { recordAudit } from "./audit";
import { BadRequestError } from "@/lib/errors";
import { AlignmentInputError, alignmentResiduals, type AlignmentResult } from "@/lib/alignment";
import { handednessMessage } from "@/lib/alignment/alignment-input-error";
import { determinant } from "@/lib/geometry/affine";
import { checkInsideImage, fitAlignment, type AlignmentModel } from "@/lib/alignment/fit";
import type { AlignmentBody } from "@/lib/validation/alignment";
import type { AlignmentDto } from "@/lib/dto/alignment";
import type { Transform } from "@/lib/geometry/types";

function toDto(r: MicrographRow): AlignmentDto {
  const residuals = r.residualsUm ?? [];
  return {
    micrographId: r.id,
    isReference: r.isReference,
    model: (r.alignmentModel as AlignmentModel | null) ?? null,
    mirrored: r.mirrored,
    pairs: r.controlPoints ?? [],
    transform: r.transform ?? null,
    residualsUm: residuals,
    rmsUm: r.alignmentRmsUm ?? null,
    worstIndex: residuals.length ? residuals.indexOf(Math.max(...residuals)) : null,
  };
}

const plainTransform = (t: AlignmentResult["transform"]): Transform => [
  [t[0][0], t[0][1], t[0][2]],
  [t[1][0], t[1][1], t[1][2]],
];

/** An accepted refinement: a transform of the right handedness, measured on the pairs. */
function givenTransform(t: Transform, body: AlignmentBody): AlignmentResult {
  const det = determinant(t);
  if (!t.flat().every(Number.isFinite) || det === 0) throw new AlignmentInputError("the transform must hold finite numbers and be invertible");
  if (det > 0 !== (body.mirrored ?? false))
    throw new AlignmentInputError(handednessMessage(body.mirrored ?? false).replace("control points fit", "transform fits"));
  return alignmentResiduals(t, body.pairs);
}

/** Solves the body against the micrograph's size; solver refusals become 400 with its message. */
function solve(row: MicrographRow, body: AlignmentBody): AlignmentResult {
  try {
    if (!row.width || !row.height) throw new AlignmentInputError("the micrograph's size is not known yet; wait for it to be read");
    checkInsideImage(body.pairs, row.width, row.height);
    const fit = fitAlignment(body.model, body.pairs, { mirrored: body.mirrored ?? false });
    return body.transform ? givenTransform(body.transform, body) : fit;
  } catch (e) {
    if (e instanceof AlignmentInputError) {
      const message = e.message.charAt(0).toUpperCase() + e.message.slice(1);
      throw new BadRequestError(
        `Alignment refused: ${message}.`,
        e.pairIndices.map((i) => ({ path: `pairs.${i}`, message: e.message })),
      );
    }
    throw e;
  }
}

/** The stored alignment of a micrograph (any member may read it). */
export async function getAlignment(db: Db, actor: Actor, id: string): Promise<AlignmentDto> {
  return toDto((await loadMicrograph(db, actor, id, "read")).row);
}

/** Solves without storing, for the live re-solve while the analyst edits pairs (edit right needed). */
export async function previewAlignment(db: Db, actor: Actor, id: string, body: AlignmentBody) {
  const { row } = await loadMicrograph(db, actor, id, "edit");
  const r = solve(row, body);
  return { transform: plainTransform(r.transform), residualsUm: r.residualsUm, rmsUm: r.rmsUm, worstIndex: r.worstIndex };
}

/**
 * Solves and stores a micrograph's alignment: transform, control points, model, mirrored flag,
 * residuals and RMS, with an audit event holding the before and after, in one transaction.
 */
export async function saveAlignment(db: Db, actor: Actor, id: string, body: AlignmentBody) {
  return db.transaction(async (tx) => {
    const { row, die } = await loadMicrograph(tx, actor, id, "edit");
    // The reference's placement is the die frame the markup is read in; other photos may be
    // aligned while the die is checked (the checker often adds one to compare).
    if (row.isReference) await assertMarkupOpen(tx, row.dieId);
    const r = solve(row, body);
    const [after] = await tx
      .update(micrographs)
      .set({
        transform: plainTransform(r.transform),
        controlPoints: body.pairs.map((p) => ({ imagePx: [p.imagePx[0], p.imagePx[1]], dieUm: [p.dieUm[0], p.dieUm[1]] })),
        alignmentModel: body.model,
        mirrored: body.mirrored ?? false,
        residualsUm: r.residualsUm,
        alignmentRmsUm: r.rmsUm,
        updatedAt: new Date(),
      })
      .where(eq(micrographs.id, id))
      .returning();
    const pick = (m: MicrographRow) => ({
      transform: m.transform,
      controlPoints: m.controlPoints,
      alignmentModel: m.alignmentModel,
      mirrored: m.mirrored,
      residualsUm: m.residualsUm,
      alignmentRmsUm: m.alignmentRmsUm,
    });
    await recordAudit(tx, actor, {
      teamId: die.teamId,
      action: "micrograph.aligned",
      entityType: "micrograph",
      entityId: id,
      dieId: row.dieId,
      before: pick(row),
      after: pick(after),
    });
    return { ...toDto(after), transform: plainTransform(r.transform), residualsUm: r.residualsUm, rmsUm: r.rmsUm, worstIndex: r.worstIndex };
  });
}

/**
 * The two micrographs a refinement compares, authorized for editing the moving one: the moving
 * micrograph and the one it is matched against (the given one, else the die's reference, else
 * another aligned micrograph). Both must be tiled (their previews are what is correlated).
 */
export async function loadRefinePair(db: Db, actor: Actor, id: string, againstId?: string) {
  const { row } = await loadMicrograph(db, actor, id, "edit");
  let against: MicrographRow | undefined;
  if (againstId) {
    against = (await loadMicrograph(db, actor, againstId, "read")).row;
    if (against.dieId !== row.dieId) throw new BadRequestError("Refine against a micrograph of the same die.");
  } else {
    const siblings = await db.select().from(micrographs).where(eq(micrographs.dieId, row.dieId));
    const aligned = siblings.filter((m) => m.id !== id && m.transform);
    against = aligned.find((m) => m.isReference) ?? aligned[0];
  }
  if (!against || against.id === id || !against.transform)
    throw new BadRequestError("Refinement needs another micrograph of this die that is already aligned.");
  for (const m of [row, against]) {
    if (m.status !== "ready" && !m.previewWidth) throw new BadRequestError(`“${m.label}” is still being tiled; refine once its preview is ready.`);
  }
  return { moving: row, against };
}
