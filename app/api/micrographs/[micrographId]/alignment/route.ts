import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { getAlignment, saveAlignment } from "@/server/access/alignment";
import { uuidSchema } from "@/lib/validation/common";
import { alignmentBodySchema } from "@/lib/validation/alignment";

const params = z.object({ micrographId: uuidSchema });

/** The stored alignment: transform, control points, model, residuals and RMS. */
export const GET = apiRoute({ params }, ({ db, actor, params }) => getAlignment(db, actor, params.micrographId));

/** Solves the control points and stores the transform (owner/analyst); 400 with the solver's reason. */
export const PUT = apiRoute({ params, body: alignmentBodySchema }, ({ db, actor, params, body }) => saveAlignment(db, actor, params.micrographId, body));
