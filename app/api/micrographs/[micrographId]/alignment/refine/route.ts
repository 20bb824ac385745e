import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadRefinePair } from "@/server/access/alignment";
import { proposeRefinement } from "@/server/alignment-refine";
import { BadRequestError } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { refineBodySchema } from "@/lib/validation/alignment";

export const runtime = "nodejs";
const params = z.object({ micrographId: uuidSchema });

/**
 * Proposes a refined transform by phase correlation against an aligned micrograph; stores
 * nothing. Body (all optional): the rough `transform` (default: the stored one), the `pairs` to
 * report RMS on (default: the stored control points), `againstId`.
 */
export const POST = apiRoute({ params, body: refineBodySchema }, async ({ db, actor, params, body }) => {
  const { moving, against } = await loadRefinePair(db, actor, params.micrographId, body.againstId);
  const rough = body.transform ?? moving.transform;
  if (!rough) throw new BadRequestError("Align the micrograph roughly with control points first, then refine.");
  if (!rough.flat().every(Number.isFinite)) throw new BadRequestError("The transform must hold finite numbers.");
  return proposeRefinement(moving, against, rough, body.pairs ?? moving.controlPoints ?? []);
});
