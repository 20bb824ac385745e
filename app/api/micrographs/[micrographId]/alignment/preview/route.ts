import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { previewAlignment } from "@/server/access/alignment";
import { uuidSchema } from "@/lib/validation/common";
import { alignmentBodySchema } from "@/lib/validation/alignment";

const params = z.object({ micrographId: uuidSchema });

/** Dry run of PUT …/alignment: the same answer, nothing stored. */
export const POST = apiRoute({ params, body: alignmentBodySchema }, ({ db, actor, params, body }) => previewAlignment(db, actor, params.micrographId, body));
