import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { BadRequestError } from "@/lib/errors";
import { ESTIMATE_KINDS, EstimateInputError, estimate } from "@/lib/estimates";

const params = z.object({ kind: z.enum(ESTIMATE_KINDS, `kind must be one of ${ESTIMATE_KINDS.join(", ")}`) });

/**
 * First-order estimates from geometry: values with units, the formula's name, its published
 * source and validity warnings. Signed-in users only; no team data is read.
 */
export const GET = apiRoute({ params }, async ({ params, req }) => {
  const query = Object.fromEntries(new URL(req.url).searchParams);
  try {
    return estimate(params.kind, query);
  } catch (e) {
    if (e instanceof EstimateInputError) throw new BadRequestError(e.message, [{ path: e.parameter, message: e.message }]);
    throw e;
  }
});
